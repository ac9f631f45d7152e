import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSetup, analyzeSetupFast, analyzeSetupFully } from '@shared/analyze';
import { contentHash } from '@shared/canonical/content-hash';
import { readSetupFast } from '@shared/parse/fast-read';
import { MAX_NESTING_DEPTH } from '@shared/parse/limits';
import { parseYaml } from '@shared/parse/parse-yaml';
import { invalidFixtures, validFixtures } from './setup-fixtures';

// The fast reader (js-yaml) may only answer where it reads exactly what the reference
// reader (the `yaml` package, YAML 1.2 core schema) reads; everywhere else it declines.

function expectSameOrDeclined(text: string): 'same' | 'declined' {
  const fast = readSetupFast(text);
  if (fast === null) return 'declined';
  const full = parseYaml(text);
  expect(full.readable).toBe(true);
  expect(fast).toStrictEqual(full.data);
  return 'same';
}

describe('the fast reader on the fixtures', () => {
  it.each(validFixtures().map((fixture) => [fixture.name, fixture.text]))(
    'reads %s to the reference data and hash',
    (_, text) => {
      const fast = readSetupFast(text);
      const full = parseYaml(text);
      expect(fast).not.toBeNull();
      expect(fast).toStrictEqual(full.data);
      expect(contentHash(fast)).toBe(contentHash(full.data));
      expect(analyzeSetupFast(text)).toStrictEqual(analyzeSetupFully(text));
    },
  );

  it.each(invalidFixtures().map((fixture) => [fixture.name, fixture.text]))(
    'leaves %s, which has findings, to the reference',
    (_, text) => {
      expect(analyzeSetupFast(text)).toBeNull();
      expect(analyzeSetup(text)).toStrictEqual(analyzeSetupFully(text));
    },
  );
});

describe('the fast reader on scalar forms', () => {
  // [yaml-1.2] 10.3.2: the core schema's null, bool, int and float forms; everything
  // else (yes/no/on/off, timestamps, 0b, underscores) is a string in YAML 1.2.
  it.each([
    'yes',
    'no',
    'on',
    'off',
    'Yes',
    'TRUE',
    'True',
    'true',
    'False',
    'false',
    'null',
    'Null',
    'NULL',
    '~',
    '',
    '0o17',
    '0O17',
    '0x1F',
    '0X1F',
    '+0x1F',
    '0b101',
    '012',
    '+12',
    '-12',
    '0',
    '-0',
    '1_000',
    '1e3',
    '1E3',
    '1e+3',
    '-1.5e-3',
    '.5',
    '5.',
    '-.5',
    '1.50',
    '0.0',
    '-0.0',
    '.inf',
    '+.inf',
    '-.inf',
    '.Inf',
    '.INF',
    '.nan',
    '.NaN',
    '.NAN',
    'inf',
    'nan',
    '1e400',
    '-1e309',
    '1'.repeat(400),
    '5e-324',
    '1e-400',
    '9007199254740993',
    '2026-01-01',
    '2026-01-01T10:00:00Z',
    '12:30',
    '1:20:30',
    '"12"',
    "'12'",
    '"0x1F"',
    '"true"',
    "'it''s'",
    '"\\x41\\u00e9\\N\\_\\t"',
    '"a\\\n  b"',
    "'a\n  b'",
    '!!binary aGVsbG8=',
    '!!str 12',
    '!!int "12"',
    '!custom x',
    '&a 1',
    'a # comment',
    'a#b',
    '|\n  one\n  two\n',
    '>-\n  one\n  two\n',
    '|2+\n   kept\n\n',
    'folded\n  plain\n\n  lines',
    '[1, 0x1F, .inf, ~, yes]',
    '{a: 1, b: [x, "y"]}',
  ])('reads `k: %s` as the reference does, or declines', (value) => {
    expectSameOrDeclined(`k: ${value}\n`);
  });

  it.each(['null', 'Null', '~', '""', 'true', '0x1F', '1e3', '.inf', '-0', '012', '2026-01-01', "'a'", 'a b', '1_0'])(
    'reads the key `%s` as the reference does, or declines',
    (key) => {
      expectSameOrDeclined(`${key}: 1\n`);
    },
  );

  it.each([
    ['an anchor and alias', 'a: &x 1\nb: *x\n'],
    ['a merge key', 'a: {x: 1}\nb:\n  <<: {x: 2}\n'],
    ['a tag', 'a: !!binary aGVsbG8=\n'],
    ['a YAML 1.1 directive', '%YAML 1.1\n---\nk: yes\n'],
    ['a number too large for a double', 'k: 1e400\n'],
    ['a quoted number', 'k: "12"\n'],
    ['a null key', '~: 1\n'],
    ['duplicate keys', 'k: 1\nk: 2\n'],
    ['keys equal only as text', '1: a\n"1": b\n'],
    ['a complex key', '? [a]\n: 1\n'],
    ['several documents', 'a: 1\n---\nb: 2\n'],
    ['a list root', '- 1\n'],
    ['a scalar root', 'just words\n'],
    ['an empty text', ''],
    ['broken YAML', 'k: [a, b\n'],
    ['a control character', 'k: x\u0001\n'],
    ['nesting past the limit', `k: ${'['.repeat(MAX_NESTING_DEPTH)}${']'.repeat(MAX_NESTING_DEPTH)}\n`],
  ])('declines %s', (_, text) => {
    expect(readSetupFast(text)).toBeNull();
  });

  it('reads nesting up to the limit', () => {
    const depth = MAX_NESTING_DEPTH - 1;
    expect(expectSameOrDeclined(`k: ${'['.repeat(depth)}${']'.repeat(depth)}\n`)).toBe('same');
  });
});

describe('the fast reader on damaged text', () => {
  // Random edits of a real setup: wherever js-yaml still answers, the reference must
  // have read the same text, to the same data (js-yaml must never be more lenient).
  const base = validFixtures().find((fixture) => fixture.name === 'trainer-single-receiver')!.text;
  const edit = fc.record({
    at: fc.nat({ max: base.length }),
    remove: fc.nat({ max: 4 }),
    insert: fc.oneof(
      fc.constantFrom(
        '\t',
        ' ',
        '  ',
        '\n',
        ':',
        '- ',
        '#',
        '"',
        "'",
        '[',
        ']',
        '{',
        '}',
        ',',
        '?',
        '|',
        '>',
        '---\n',
        '~',
        '0x',
        '.',
        'e9',
      ),
      fc.string({ maxLength: 3 }),
    ),
  });

  it('is never more lenient than the reference, nor reads differently', () => {
    let same = 0;
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 3 }), (edits) => {
        let text = base;
        for (const { at, remove, insert } of edits) text = text.slice(0, at) + insert + text.slice(at + remove);
        if (expectSameOrDeclined(text) === 'same') same += 1;
      }),
      { numRuns: 1000, seed: 20260103 },
    );
    expect(same).toBeGreaterThan(100);
  }, 60_000);
});
