import { Badge } from '../../../components/ui/badge';
import { MARK_WORDS, type ChannelMark } from '../channel-plan';
import { MARK_ICONS } from './mark-icons';

const SEVERITY_WORDS = { error: 'Error', warning: 'Warning', info: 'Note' } as const;

/** A mark in the channel plan: icon, word and the tone of the finding behind it. */
export function MarkBadge({ mark }: { mark: ChannelMark }) {
  const { severity } = mark.finding;
  if (mark.kind === 'accepted') {
    return (
      <span title={`${mark.finding.message} Accepted: ${mark.finding.accepted ?? ''}`}>
        <Badge tone="neutral" icon={MARK_ICONS.accepted}>
          {MARK_WORDS.accepted}
        </Badge>
      </span>
    );
  }
  const tone = severity === 'error' ? 'danger' : severity === 'warning' ? 'caution' : 'info';
  // Another finding is named by its severity: the row's findings below say what it is.
  const word = mark.kind === 'finding' ? SEVERITY_WORDS[severity] : MARK_WORDS[mark.kind];
  return (
    <span title={mark.finding.message}>
      <Badge tone={tone} icon={MARK_ICONS[mark.kind]}>
        {word}
        {mark.kind === 'finding' && <span className="sr-only">: {mark.finding.message}</span>}
      </Badge>
    </span>
  );
}
