import canonicalize from 'canonicalize';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '@shared/canonical/content-hash';
import { analyzeSetup } from '@shared/analyze';
import { validFixtures } from './setup-fixtures';

// [rfc-8785] The canonical form (keys sorted by UTF-16 code units, ECMAScript number
// formatting, no whitespace) against an independent implementation, npm `canonicalize`.

describe('the canonical form is RFC 8785 JSON', () => {
  it('on generated JSON documents', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        // A generated document is not a setup, so no defaults are filled in.
        expect(canonicalJson(value)).toBe(canonicalize(value));
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });

  it('on the valid fixtures, once the format defaults are filled in', () => {
    for (const fixture of validFixtures()) {
      const setup = analyzeSetup(fixture.text).setup;
      expect(canonicalJson(setup)).toBe(canonicalize(setup));
    }
  });
});
