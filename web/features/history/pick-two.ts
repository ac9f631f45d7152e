import type { RevisionSummary } from '../models/types';

/**
 * Picking revisions to compare: at most two at a time; picking a third lets go of the
 * one picked first, so the latest two choices are always the pair.
 */
export function togglePick(picked: readonly string[], id: string): string[] {
  if (picked.includes(id)) return picked.filter((other) => other !== id);
  return [...picked, id].slice(-2);
}

/** The pair in compare order: the older revision is `from`, the newer `to`. */
export function comparePair(
  picked: readonly string[],
  revisions: readonly RevisionSummary[],
): { from: RevisionSummary; to: RevisionSummary } | null {
  if (picked.length !== 2) return null;
  const chosen = picked.map((id) => revisions.find((revision) => revision.id === id));
  const [a, b] = chosen;
  if (!a || !b) return null;
  return a.number < b.number ? { from: a, to: b } : { from: b, to: a };
}

export const compareSearch = (from: { id: string }, to: { id: string }) =>
  `?from=${encodeURIComponent(from.id)}&to=${encodeURIComponent(to.id)}`;
