import { Link } from 'react-router-dom';
import { Badge, SeverityBadge } from '../../../components/ui/badge';
import { CheckIcon } from '../../../components/ui/icons';
import { buttonClasses, Button } from '../../../components/ui/button';
import { cx } from '../../../lib/cx';
import { revisionDownloadUrl } from '../../models/api/get-revision';
import { CheckBadges } from '../../models/components/check-badges';
import { TimeAgo } from '../../models/components/time-ago';
import type { RevisionOrigin, RevisionSummary, SetupModelView } from '../../models/types';
import { compareSearch } from '../pick-two';
import { TagEditor, TagList } from './tag-editor';

const ORIGIN_WORDS: Partial<Record<RevisionOrigin, string>> = {
  create: 'created',
  upload: 'uploaded from a file',
  revert: 'a revert',
  fork: 'forked',
  merge: 'took in the source’s changes',
};

export interface RevisionTimelineProps {
  model: SetupModelView;
  revisions: RevisionSummary[];
  picked: string[];
  onPick: (id: string) => void;
  editable: boolean;
  onRevert: (revision: RevisionSummary) => void;
  /** Absent when the reader can edit no workspace, so a fork could go nowhere. */
  onFork?: (revision: RevisionSummary) => void;
}

/**
 * Where the cards begin: right of the timeline's margin (ml-3), its 2px line and each
 * item's padding (pl-6). The compare bar above the timeline lines up with the cards by it.
 */
export const CARD_INSET = 'ml-[calc(2.25rem+2px)]';

export function RevisionTimeline({
  model,
  revisions,
  picked,
  onPick,
  editable,
  onRevert,
  onFork,
}: RevisionTimelineProps) {
  const latest = model.latest?.number;
  const byId = new Map(revisions.map((revision) => [revision.id, revision]));
  return (
    <ol className="relative ml-3 border-l-2 border-ply-300">
      {revisions.map((revision, index) => {
        const isPicked = picked.includes(revision.id);
        const previous = revisions[index + 1];
        const source = revision.source_revision_id ? byId.get(revision.source_revision_id) : undefined;
        return (
          <li key={revision.id} className="relative pb-5 pl-6">
            <span
              aria-hidden="true"
              className={cx(
                'absolute top-4 -left-[9px] h-4 w-4 rounded-full border-2',
                isPicked
                  ? 'border-accent-700 bg-accent-700'
                  : revision.number === latest
                    ? 'border-accent-700 bg-paper-raised'
                    : 'border-ply-500 bg-paper',
              )}
            />
            <article
              aria-labelledby={`rev-${revision.id}`}
              className={cx(
                'rounded-lg border bg-paper-raised px-4 py-3 shadow-card',
                isPicked ? 'border-accent-700 ring-2 ring-accent-600/30' : 'border-ply-200',
              )}
            >
              <div className="flex flex-wrap items-start gap-x-3 gap-y-2">
                <label className="flex shrink-0 cursor-pointer items-center gap-2 pt-0.5">
                  <input
                    type="checkbox"
                    checked={isPicked}
                    onChange={() => onPick(revision.id)}
                    className="h-4 w-4 accent-accent-700"
                  />
                  <span className="sr-only">Pick revision {revision.number} to compare</span>
                </label>
                <div className="min-w-0 flex-1">
                  <h3
                    id={`rev-${revision.id}`}
                    className="flex flex-wrap items-baseline gap-x-2 text-base text-ink-900"
                  >
                    {/* Each row opens its revision: the Overview, and from there its bench and field sheet. */}
                    <Link
                      to={`/models/${model.id}/overview?revision=${revision.number}`}
                      className="font-mono font-semibold"
                      title={`Open revision ${revision.number}`}
                    >
                      r{revision.number}
                    </Link>
                    <span className="font-medium break-words">
                      {revision.message || <span className="font-normal text-ink-500">no message</span>}
                    </span>
                    {revision.number === latest && <span className="text-sm font-normal text-accent-700">latest</span>}
                    {model.approved?.id === revision.id && (
                      <Badge tone="moss" icon={CheckIcon}>
                        Approved, cleared to fly
                      </Badge>
                    )}
                  </h3>
                  <p className="mt-0.5 text-sm text-ink-700">
                    <TimeAgo iso={revision.created_at} />
                    {revision.author && ` by ${revision.author.name}`}
                    {ORIGIN_WORDS[revision.origin] && ` · ${ORIGIN_WORDS[revision.origin]}`}
                    {revision.origin === 'revert' && source && ` to r${source.number}`}
                  </p>
                  <div className="mt-2 flex flex-wrap items-center gap-2">
                    <CheckBadges errors={revision.error_count} warnings={revision.warning_count} />
                    {revision.info_count > 0 && <SeverityBadge severity="info" count={revision.info_count} />}
                    {editable ? <TagEditor model={model} revision={revision} /> : <TagList tags={revision.tags} />}
                  </div>
                </div>
                <div className="flex w-full flex-wrap gap-1.5 pl-7 lg:w-auto lg:justify-end lg:pl-0">
                  {previous && (
                    <Link
                      to={`/models/${model.id}/compare${compareSearch(previous, revision)}`}
                      className={buttonClasses('quiet', 'sm')}
                    >
                      Changes since r{previous.number}
                    </Link>
                  )}
                  <a href={revisionDownloadUrl(revision.id)} download className={buttonClasses('secondary', 'sm')}>
                    Download .yaml
                  </a>
                  {editable && revision.number !== latest && (
                    <Button size="sm" variant="secondary" onClick={() => onRevert(revision)}>
                      Revert to this
                    </Button>
                  )}
                  {onFork && (
                    <Button size="sm" variant="secondary" onClick={() => onFork(revision)}>
                      Fork
                    </Button>
                  )}
                </div>
              </div>
            </article>
          </li>
        );
      })}
    </ol>
  );
}
