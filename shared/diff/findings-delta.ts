import type { Finding } from '../findings';

export interface FindingsDelta {
  /** Findings of the new revision that the old one did not have. */
  introduced: Finding[];
  /** Findings of the old revision that the new one no longer has. */
  resolved: Finding[];
  /** Findings open in the old revision that the new one accepts, with the reason. */
  accepted: Finding[];
}

// A finding is the same across revisions when its rule and semantic path are: its
// line moves whenever lines above it change, and a message may name a different
// example (mix-saturates) for the same problem. Several findings with one rule and
// path are matched as a multiset, so a third duplicate shows as introduced. Whether a
// finding is accepted is part of its state: one the new revision accepts is listed as
// accepted (neither gone nor new), and one whose acceptance was taken back is open
// again, so it is listed as introduced.
function key(finding: Pick<Finding, 'rule' | 'path'>): string {
  return `${finding.rule}\u0000${finding.path}`;
}

const stateKey = (finding: Finding): string =>
  `${key(finding)}\u0000${finding.accepted === undefined ? 'open' : 'accepted'}`;

/** Takes one item of `pool` with the key of `finding`, answering whether there was one. */
function take(pool: Map<string, Finding[]>, wanted: string): Finding | undefined {
  const items = pool.get(wanted);
  return items?.shift();
}

function pooled(findings: readonly Finding[], keyOf: (finding: Finding) => string): Map<string, Finding[]> {
  const pool = new Map<string, Finding[]>();
  for (const finding of findings) pool.set(keyOf(finding), [...(pool.get(keyOf(finding)) ?? []), finding]);
  return pool;
}

export function findingsDelta(before: readonly Finding[], after: readonly Finding[]): FindingsDelta {
  const same = pooled(before, stateKey);
  const unmatched = after.filter((finding) => take(same, stateKey(finding)) === undefined);
  const left = pooled([...same.values()].flat(), key);
  const introduced: Finding[] = [];
  const accepted: Finding[] = [];
  for (const finding of unmatched) {
    const was = take(left, key(finding));
    if (was && finding.accepted !== undefined && was.accepted === undefined) accepted.push(finding);
    else introduced.push(finding);
  }
  const resolved = before.filter((finding) => (left.get(key(finding)) ?? []).includes(finding));
  return { introduced, resolved, accepted };
}
