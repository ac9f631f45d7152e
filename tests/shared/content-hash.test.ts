import fc from 'fast-check';
import { stringify } from 'yaml';
import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { canonicalJson, canonicalJsonOfChecked, contentHash } from '@shared/canonical/content-hash';
import { sha256Hex } from '@shared/canonical/sha256-hex';
import { parseYaml } from '@shared/parse/parse-yaml';
import { invalidFixtures, readFixture, validFixtures } from './setup-fixtures';

const dataOf = (text: string) => {
  const parsed = parseYaml(text);
  if (!parsed.readable) throw new Error('unreadable');
  return parsed.data;
};

describe('sha256Hex', () => {
  it('gives the FIPS 180-4 test vector for "abc"', () => {
    // [sha-256] SHA-256("abc")
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('hashes the UTF-8 bytes', () => {
    // [sha-256] SHA-256 of the empty string
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(sha256Hex('é')).not.toBe(sha256Hex('e'));
  });
});

describe('canonical JSON', () => {
  it('sorts keys at every level and keeps lists in order', () => {
    expect(canonicalJson({ b: [3, { z: 1, a: 2 }], a: 'x' })).toBe('{"a":"x","b":[3,{"a":2,"z":1}]}');
  });

  it('fills in defaults for a valid setup', () => {
    const canonical = JSON.parse(canonicalJson(dataOf(readFixture('valid/trainer-single-receiver.yaml'))));
    expect(canonical.channels[0].travel).toEqual({ center_us: 1500, high_us: 2000, low_us: 1000, reverse: false });
    expect(canonical.receivers[0].telemetry).toBe(true);
  });

  it('keeps the data as it is when the setup is not valid', () => {
    expect(canonicalJson({ format: 'other', b: 1, a: 2 })).toBe('{"a":2,"b":1,"format":"other"}');
  });
});

describe('content hash', () => {
  const text = readFixture('valid/trainer-single-receiver.yaml');
  const hash = contentHash(dataOf(text));

  it('is lowercase hex SHA-256', () => {
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('ignores comments, formatting and defaults written out', () => {
    const rewritten = text
      .replace(/#.*$/gm, '')
      .replace('  - { id: rate-switch,    kind: switch }', '  - id: rate-switch\n    kind: switch\n    positions: 2')
      .replace(
        '  - { id: motor,    from: throttle-stick, to: 3 }',
        '  - { id: motor, from: throttle-stick, to: 3, weight: 100, offset: 0, expo: 0 }',
      )
      .replace('    outputs: 6\n', '    outputs: 6\n    role: primary\n    telemetry: true\n');
    expect(rewritten).not.toBe(text);
    expect(contentHash(dataOf(rewritten))).toBe(hash);
  });

  it('changes when a value changes or a list is reordered', () => {
    expect(contentHash(dataOf(text.replace('failsafe: 1000', 'failsafe: 1010')))).not.toBe(hash);
    const data = dataOf(text) as { mixes: unknown[] };
    data.mixes.reverse();
    expect(contentHash(data)).not.toBe(hash);
  });

  it('is stable under reordering keys and reformatting (property)', () => {
    const fixtures = validFixtures().map((fixture) => ({
      data: dataOf(fixture.text),
      hash: contentHash(dataOf(fixture.text)),
    }));
    fc.assert(
      fc.property(
        fc.constantFrom(...fixtures),
        fc.infiniteStream(fc.double({ min: 0, max: 1, noNaN: true })),
        fc.record({ indent: fc.integer({ min: 1, max: 8 }), flow: fc.boolean(), comment: fc.boolean() }),
        ({ data, hash: expected }, randoms, style) => {
          const next = (() => {
            const iterator = randoms[Symbol.iterator]();
            return () => iterator.next().value as number;
          })();
          const shuffled = shuffleKeys(data, next);
          const document = stringify(shuffled, {
            indent: style.indent,
            indentSeq: style.indent > 1,
            collectionStyle: style.flow ? 'flow' : 'any',
            lineWidth: 0,
          });
          const reformatted = style.comment
            ? `# reformatted\n${document.replace(/\n(?=.)/g, '  # a note\n')}`
            : document;
          expect(contentHash(dataOf(reformatted))).toBe(expected);
        },
      ),
      { numRuns: 100 },
    );
  });
});

function shuffleKeys(value: unknown, random: () => number): unknown {
  if (Array.isArray(value)) return value.map((item) => shuffleKeys(item, random));
  if (value === null || typeof value !== 'object') return value;
  const entries = Object.entries(value as Record<string, unknown>);
  for (let i = entries.length - 1; i > 0; i -= 1) {
    const j = Math.floor(random() * (i + 1)) % (i + 1);
    [entries[i], entries[j]] = [entries[j], entries[i]];
  }
  return Object.fromEntries(entries.map(([key, item]) => [key, shuffleKeys(item, random)]));
}

describe("canonical JSON of checked data (the save path reuses the checks' schema result)", () => {
  it('equals the canonical JSON for every valid and invalid fixture', () => {
    const fixtures = [...validFixtures(), ...invalidFixtures()];
    expect(fixtures.length).toBeGreaterThan(20);
    let valid = 0;
    for (const fixture of fixtures) {
      const analysis = analyzeSetup(fixture.text);
      if (!analysis.readable) continue;
      if (analysis.setup) valid += 1;
      expect(canonicalJsonOfChecked(analysis.data, analysis.setup), fixture.file).toBe(canonicalJson(analysis.data));
    }
    expect(valid).toBeGreaterThan(5);
  });
});
