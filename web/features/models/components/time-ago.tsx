import { exactTime, isRecent, timeAgo } from '../format-time';

/**
 * A time as lists show it (format-time.ts), the exact moment in its tooltip. In running
 * prose (`inSentence`) a date reads "on 14 Mar 2025"; "3 days ago" needs no "on".
 */
export function TimeAgo({
  iso,
  className,
  inSentence = false,
}: {
  iso: string;
  className?: string;
  inSentence?: boolean;
}) {
  return (
    <>
      {inSentence && !isRecent(iso) && 'on '}
      <time dateTime={iso} title={exactTime(iso)} className={className}>
        {timeAgo(iso)}
      </time>
    </>
  );
}
