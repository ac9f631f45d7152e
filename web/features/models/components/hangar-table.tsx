import { Link } from 'react-router-dom';
import { Badge, ReviewStateBadge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { ChevronDownIcon } from '../../../components/ui/icons';
import { cx } from '../../../lib/cx';
import { firstDirection, type HangarColumn, type HangarSort } from '../sort-models';
import type { SetupModelView } from '../types';
import { CheckBadges } from './check-badges';
import { TimeAgo } from './time-ago';
import { clearedWords } from '../cleared-words';

const COLUMNS: { column: HangarColumn; label: string; className?: string }[] = [
  { column: 'name', label: 'Model' },
  { column: 'airframe', label: 'Airframe' },
  { column: 'revision', label: 'Revision', className: 'text-right' },
  { column: 'checks', label: 'Checks' },
  { column: 'review', label: 'Review' },
  { column: 'changed', label: 'Last change' },
];

export interface HangarTableProps {
  models: SetupModelView[];
  sort: HangarSort;
  onSort: (sort: HangarSort) => void;
}

export function HangarTable({ models, sort, onSort }: HangarTableProps) {
  const toggle = (column: HangarColumn) =>
    onSort(
      sort.column === column
        ? { column, direction: sort.direction === 'ascending' ? 'descending' : 'ascending' }
        : { column, direction: firstDirection(column) },
    );

  return (
    <Card className="overflow-x-auto">
      <table className="w-full text-left text-base">
        <caption className="sr-only">Models in this workspace; the column headings sort the table</caption>
        <thead className="border-b border-ply-200 text-sm text-ink-700">
          <tr>
            {COLUMNS.map(({ column, label, className }) => {
              const active = sort.column === column;
              return (
                <th
                  key={column}
                  scope="col"
                  aria-sort={active ? sort.direction : undefined}
                  className={cx('px-3 py-2 font-medium', className)}
                >
                  <button
                    type="button"
                    onClick={() => toggle(column)}
                    className={cx(
                      'inline-flex items-center gap-1 rounded-sm py-1 whitespace-nowrap hover:text-ink-900',
                      active && 'text-ink-900',
                    )}
                  >
                    {label}
                    <ChevronDownIcon
                      className={cx(
                        'transition-transform',
                        active ? 'opacity-100' : 'opacity-30',
                        active && sort.direction === 'ascending' && 'rotate-180',
                      )}
                    />
                  </button>
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody className="divide-y divide-ply-100">
          {models.map((model) => (
            <tr key={model.id} className="hover:bg-paper">
              <td className="px-3 py-3">
                <Link to={`/models/${model.id}/overview`} className="font-medium">
                  {model.name}
                </Link>
                {model.archived_at && (
                  <Badge className="ml-2" tone="neutral">
                    Archived
                  </Badge>
                )}
                {model.forked_from && (
                  <span className="block text-sm text-ink-500">
                    fork of {model.forked_from.model_name ?? 'a model in another workspace'} r{model.forked_from.number}
                  </span>
                )}
              </td>
              <td className="px-3 py-3 text-ink-700 capitalize">{model.airframe ?? '—'}</td>
              <td className="px-3 py-3 text-right font-mono text-sm text-ink-900">
                {model.latest ? `r${model.latest.number}` : '—'}
              </td>
              <td className="px-3 py-3">
                {model.latest ? (
                  <CheckBadges errors={model.latest.error_count} warnings={model.latest.warning_count} />
                ) : (
                  '—'
                )}
              </td>
              <td className="px-3 py-3">
                <ReviewStateBadge state={model.review_state} />
                {model.review_state !== 'approved' && clearedWords(model) && (
                  <span className="mt-1 block text-sm text-ink-700">{clearedWords(model)}</span>
                )}
              </td>
              <td className="px-3 py-3 text-sm text-ink-700">
                {model.latest ? (
                  <>
                    <TimeAgo iso={model.latest.created_at} className="block text-ink-900" />
                    {model.latest.author && <span className="block">by {model.latest.author.name}</span>}
                  </>
                ) : (
                  <TimeAgo iso={model.updated_at} />
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
