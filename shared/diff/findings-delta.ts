import type { Finding } from '../findings';

export interface FindingsDelta {
  /** Findings of the new revision that the old one did not have. */
  introduced: Finding[];
  /** Findings of the old revision that the new one no longer has. */
  resolved: Finding[];
}

// A finding is the same across revisions when its rule and semantic path are: its
// line moves whenever lines above it change, and a message may name a different
// example (mix-saturates) for the same problem. Several findings with one rule and
// path are matched as a multiset, so a third duplicate shows as introduced.
function key(finding: Pick<Finding, 'rule' | 'path'>): string {
  return `${finding.rule}\u0000${finding.path}`;
}

export function findingsDelta(before: readonly Finding[], after: readonly Finding[]): FindingsDelta {
  const remaining = new Map<string, number>();
  for (const finding of before) remaining.set(key(finding), (remaining.get(key(finding)) ?? 0) + 1);
  const introduced: Finding[] = [];
  for (const finding of after) {
    const left = remaining.get(key(finding)) ?? 0;
    if (left > 0) remaining.set(key(finding), left - 1);
    else introduced.push(finding);
  }
  const stillThere = new Map<string, number>();
  for (const finding of after) stillThere.set(key(finding), (stillThere.get(key(finding)) ?? 0) + 1);
  const resolved: Finding[] = [];
  for (const finding of before) {
    const left = stillThere.get(key(finding)) ?? 0;
    if (left > 0) stillThere.set(key(finding), left - 1);
    else resolved.push(finding);
  }
  return { introduced, resolved };
}
