import type { ReviewState, SetupModelView } from './types';

export type HangarColumn = 'name' | 'airframe' | 'revision' | 'checks' | 'review' | 'changed';
export type SortDirection = 'ascending' | 'descending';

export interface HangarSort {
  column: HangarColumn;
  direction: SortDirection;
}

// Review states in the order that needs a pilot's attention first.
const REVIEW_ORDER: Record<ReviewState, number> = {
  'changes-requested': 0,
  stale: 1,
  pending: 2,
  none: 3,
  approved: 4,
};

const text = new Intl.Collator(undefined, { sensitivity: 'base', numeric: true });

type Key = (model: SetupModelView) => number | string;

// A model without a revision yet sorts as if it had the fewest problems and the oldest change.
const keys: Record<HangarColumn, Key> = {
  name: (model) => model.name,
  airframe: (model) => model.airframe ?? '',
  revision: (model) => model.latest?.number ?? 0,
  checks: (model) => (model.latest ? model.latest.error_count * 100_000 + model.latest.warning_count : -1),
  review: (model) => REVIEW_ORDER[model.review_state] ?? REVIEW_ORDER.none,
  changed: (model) => model.latest?.created_at ?? model.updated_at,
};

function compare(a: number | string, b: number | string): number {
  return typeof a === 'number' && typeof b === 'number' ? a - b : text.compare(String(a), String(b));
}

/** The models in the asked order; ties fall back to the name so the order is stable. */
export function sortModels(models: readonly SetupModelView[], { column, direction }: HangarSort): SetupModelView[] {
  const key = keys[column];
  const sign = direction === 'ascending' ? 1 : -1;
  return [...models].sort((a, b) => sign * compare(key(a), key(b)) || text.compare(a.name, b.name));
}

/** The first click on a column sorts it the way a pilot most often wants: newest, most problems, A to Z. */
export const firstDirection = (column: HangarColumn): SortDirection =>
  column === 'name' || column === 'airframe' || column === 'review' ? 'ascending' : 'descending';
