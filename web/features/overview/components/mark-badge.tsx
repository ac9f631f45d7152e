import { Badge } from '../../../components/ui/badge';
import { MARK_WORDS, type ChannelMark } from '../channel-plan';
import { MARK_ICONS } from './mark-icons';

/** A mark in the channel plan: icon, word and the tone of the finding behind it. */
export function MarkBadge({ mark }: { mark: ChannelMark }) {
  const tone = mark.finding.severity === 'error' ? 'danger' : mark.finding.severity === 'warning' ? 'caution' : 'info';
  return (
    <span title={mark.finding.message}>
      <Badge tone={tone} icon={MARK_ICONS[mark.kind]}>
        {MARK_WORDS[mark.kind]}
      </Badge>
    </span>
  );
}
