import { describe, expect, it } from 'vitest';
import { diffSetups } from '@shared/diff';
import { loadPair, type PairName } from './diff-pairs';
import { oraclePaths } from './microdiff-oracle';

// The semantic diff against an independent deep-diff, npm `microdiff`, run over the
// documents with every identity-keyed list turned into a map by its key
// (microdiff-oracle.ts): both must find the same changed paths. Pairs with renames or
// moves are left out, since a plain deep diff sees a rename as a removal and an
// addition. Generated pairs: diff-microdiff-oracle-generated.test.ts.

const PAIRS: PairName[] = ['failsafe-fix', 'trim-tuning', 'receiver-added', 'remap-second-receiver'];

describe.each(PAIRS)('the semantic diff of %s against microdiff', (name) => {
  it('finds the same changed paths', () => {
    const { before, after } = loadPair(name);
    const ours = new Set(diffSetups(before.data, after.data).changes.map((change) => change.path));
    expect([...ours].sort()).toEqual(oraclePaths(before.data, after.data));
  });
});
