import type { ProvenanceChange, ProvenanceEntry } from '@shared/contract/provenance';
import { isUnder } from '@shared/lineage/leaf-paths';

export type Provenance = ReadonlyMap<string, ProvenanceEntry>;

/**
 * The newest change to `path` or anything under it (a pin entry is as new as its
 * newest field), so one note can speak for a whole pin or mix.
 */
export function latestUnder(provenance: Provenance | undefined, path: string): ProvenanceEntry | undefined {
  if (!provenance) return undefined;
  const exact = provenance.get(path);
  if (exact) return exact;
  let newest: ProvenanceEntry | undefined;
  for (const [leaf, entry] of provenance)
    if (isUnder(leaf, path) && (!newest || entry.created_at > newest.created_at)) newest = entry;
  return newest;
}

const DAY = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** "since r4, Hattie, 16 Feb 2025: 'tailwheel centres'"; an inherited value says it came from the source. */
export function sinceText(entry: ProvenanceEntry): string {
  const who = entry.author?.name ?? 'someone no longer here';
  const where = entry.inherited ? `r${entry.revision.number} of the source` : `r${entry.revision.number}`;
  const message = entry.message ? `: ‘${entry.message}’` : '';
  return `since ${where}, ${who}, ${DAY.format(new Date(entry.created_at))}${message}`;
}

/** One line of a setting's history: "r4, Hattie, 16 Feb 2025: 'tailwheel centres'". */
export function changeText(change: ProvenanceChange): string {
  const who = change.author?.name ?? 'someone no longer here';
  const what = change.inherited ? `r${change.revision.number} (from the source)` : `r${change.revision.number}`;
  const message = change.message ? `: ‘${change.message}’` : '';
  return `${what}, ${who}, ${DAY.format(new Date(change.created_at))}${message}`;
}
