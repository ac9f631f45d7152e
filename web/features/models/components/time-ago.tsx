import { exactTime, timeAgo } from '../format-time';

export function TimeAgo({ iso, className }: { iso: string; className?: string }) {
  return (
    <time dateTime={iso} title={exactTime(iso)} className={className}>
      {timeAgo(iso)}
    </time>
  );
}
