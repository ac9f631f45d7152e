import { Badge } from '../../../components/ui/badge';

/** Whether a unit sends telemetry, in a word: on, off, or not recorded. */
export function TelemetryWord({ telemetry }: { telemetry: boolean | null }) {
  if (telemetry === null) return <span className="text-ink-500">Not recorded</span>;
  return <Badge tone={telemetry ? 'info' : 'neutral'}>{telemetry ? 'Sends' : 'Off'}</Badge>;
}
