import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { MAX_ALIAS_COUNT, MAX_NESTING_DEPTH, MAX_TEXT_BYTES } from '@shared/parse/limits';
import { parseYaml } from '@shared/parse/parse-yaml';
import { parseSemanticPath, toSemanticPath } from '@shared/parse/semantic-path';
import { locate } from '@shared/parse/source-position';
import { utf8Length } from '@shared/parse/utf8-length';
import { readFixture } from './setup-fixtures';

function syntaxOf(text: string) {
  const analysis = analyzeSetup(text);
  expect(analysis.readable).toBe(false);
  expect(analysis.data).toBeNull();
  expect(analysis.setup).toBeNull();
  expect(analysis.findings).toHaveLength(1);
  expect(analysis.findings[0]).toMatchObject({ rule: 'syntax', severity: 'error' });
  return analysis.findings[0];
}

describe('reading the text', () => {
  it('rejects duplicate keys, naming the key and pointing at the second one', () => {
    // [yaml-1.2] 3.2.1.1: the keys of a mapping are unique
    const finding = syntaxOf('format: bindery-setup/1\nmodel:\n  name: A\n  airframe: glider\n  name: B\n');
    expect(finding.message).toContain('"name"');
    expect(finding).toMatchObject({ line: 5, column: 3 });
  });

  it.each([
    ['a list', '- a\n- b\n', 'it is a list'],
    ['a single value', 'just words\n', 'it is a single value'],
    ['empty', '', 'it is empty'],
    ['only comments', '# nothing here\n', 'it is empty'],
  ])('rejects a root that is %s', (_, text, words) => {
    expect(syntaxOf(text).message).toContain(words);
  });

  it('rejects broken YAML with the position of the problem', () => {
    const finding = syntaxOf('format: bindery-setup/1\nmodel: { name: A\nlink: 3\n');
    expect(finding.line).toBeGreaterThanOrEqual(2);
  });

  it('says the common YAML mistakes in plain words, keeping the line and column', () => {
    const missingColon = syntaxOf('format: bindery-setup/1\nmodel:\n  name: Tern\n  airframe\n');
    expect(missingColon.message).toBe(
      'A name here has no colon after it, so YAML cannot tell it is a key with a value.',
    );
    expect(missingColon.message).not.toContain('Implicit map keys');
    expect([missingColon.line, missingColon.column]).toEqual([4, 3]);
    expect(syntaxOf('model:\n  name: a\n airframe: b\n').message).toBe(
      'This line is indented differently from the lines beside it.',
    );
    expect(syntaxOf('a: [1, 2\nb: 3\n').message).toContain('not closed with ]');
    expect(syntaxOf('a: "abc\nb: 1\n').message).toContain('closing quote mark is missing');
  });

  it('rejects several documents in one file', () => {
    expect(syntaxOf('a: 1\n---\nb: 2\n').message).toContain('more than one document');
  });

  it('rejects text over 512 KB without parsing it', () => {
    const text = `notes: ${'x'.repeat(MAX_TEXT_BYTES)}\n`;
    expect(syntaxOf(text).message).toContain('512 KB');
  });

  it('counts the size in UTF-8 bytes', () => {
    expect(utf8Length('aé€😀')).toBe(1 + 2 + 3 + 4);
    const text = `notes: ${'é'.repeat(MAX_TEXT_BYTES / 2)}\n`;
    expect(syntaxOf(text).message).toContain('512 KB');
  });

  it.each([
    ['brackets', `a: ${'['.repeat(200_000)}${']'.repeat(200_000)}`],
    ['dashes', `${'- '.repeat(200_000)}x\n`],
    ['explicit keys', `${'? '.repeat(200_000)}x\n`],
    ['indentation', Array.from({ length: 200 }, (_, i) => `${' '.repeat(i)}k:`).join('\n')],
  ])(`rejects nesting deeper than ${MAX_NESTING_DEPTH} levels by %s`, (_, text) => {
    expect(syntaxOf(text).message).toContain(`more than ${MAX_NESTING_DEPTH} levels`);
  });

  it('reads nesting up to the limit', () => {
    const text = `format: 1\nnotes: ${'['.repeat(MAX_NESTING_DEPTH - 1)}${']'.repeat(MAX_NESTING_DEPTH - 1)}\n`;
    expect(analyzeSetup(text).readable).toBe(true);
  });

  it('rejects aliases that expand into too many copies', () => {
    const levels = ['a: &a [x, x, x, x, x, x, x, x, x, x]'];
    for (const name of ['b', 'c', 'd', 'e']) {
      const previous = String.fromCharCode(name.charCodeAt(0) - 1);
      levels.push(`${name}: &${name} [${Array(10).fill(`*${previous}`).join(', ')}]`);
    }
    expect(syntaxOf(`${levels.join('\n')}\n`).message).toContain(`more than ${MAX_ALIAS_COUNT}`);
  });

  it.each([
    ['a mapping', 'format: bindery-setup/1\nmodel: &m\n  name: x\n  self: *m\n'],
    ['a list', 'notes: &n [a, *n]\n'],
  ])('rejects an alias inside its own anchor in %s, which would never end', (_, text) => {
    expect(syntaxOf(text).message).toContain('never end');
  });

  it('reads the few aliases a person might write', () => {
    const parsed = parseYaml('base: &t { low_us: 1000 }\ncopy: *t\n');
    expect(parsed.readable).toBe(true);
    expect(parsed.data).toEqual({ base: { low_us: 1000 }, copy: { low_us: 1000 } });
  });

  it('keeps values plain: YAML 1.1 tags stay strings', () => {
    const parsed = parseYaml('x: !!binary aGVsbG8=\n');
    expect(parsed.data).toEqual({ x: 'aGVsbG8=' });
  });

  it('keeps unknown keys in the data', () => {
    const analysis = analyzeSetup(readFixture('invalid/unknown-key.yaml'));
    expect((analysis.data as { model: Record<string, unknown> }).model.colour).toBe('yellow and black');
    expect(analysis.setup?.model).toHaveProperty('colour', 'yellow and black');
  });
});

describe('semantic paths', () => {
  const text = [
    'receivers:', //                          1
    '  - id: wing', //                        2
    '    outputs: 8', //                      3
    '    map:', //                            4
    '      - { pin: 1, ch: 9 }', //           5
    '      - pin: 3', //                      6
    '        ch: 11', //                      7
    '        failsafe: hold', //              8
    '  - id: "tail"', //                      9
    '',
  ].join('\n');
  const parsed = parseYaml(text);
  const at = (path: string) => locate(parsed.document!, parsed.lineCounter, parseSemanticPath(path));

  it('locate a field by identity keys, at its key', () => {
    expect(at('receivers[id=wing].map[pin=3].failsafe')).toEqual({ line: 8, column: 9 });
    expect(at('receivers[id=wing].map[pin=1].ch')).toEqual({ line: 5, column: 19 });
    expect(at('receivers[id=tail]')).toEqual({ line: 9, column: 5 });
  });

  it('fall back to the nearest enclosing node for a missing field', () => {
    expect(at('receivers[id=wing].map[pin=1].failsafe')).toEqual({ line: 5, column: 9 });
    expect(at('receivers[id=wing].label')).toEqual({ line: 2, column: 5 });
    expect(at('receivers[id=nobody].map')).toEqual({ line: 1, column: 1 });
    expect(at('')).toEqual({ line: 1, column: 1 });
  });

  it('are built from data paths with identity keys where the list has one', () => {
    expect(toSemanticPath(parsed.data, ['receivers', 0, 'map', 1, 'failsafe'])).toBe(
      'receivers[id=wing].map[pin=3].failsafe',
    );
    expect(toSemanticPath({ mixes: [{ rates: { weights: [1, 2] } }] }, ['mixes', 0, 'rates', 'weights', 1])).toBe(
      'mixes[0].rates.weights[1]',
    );
    expect(toSemanticPath({ model: {} }, ['model', 'odd key'])).toBe('model["odd key"]');
    expect(parseSemanticPath('model["odd key"]')).toEqual([{ key: 'model' }, { key: 'odd key' }]);
  });
});

describe('parse, property-based', () => {
  it('never throws on any string', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 400 }), (text) => {
        const analysis = analyzeSetup(text);
        expect(analysis.findings.every((f) => f.line >= 1 && f.column >= 1)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('never throws on YAML-looking noise', () => {
    const pieces = fc.constantFrom(
      'format: bindery-setup/1\n',
      'model:',
      ' name: X',
      '\n',
      '  ',
      '- ',
      '? ',
      ': ',
      '[',
      ']',
      '{',
      '}',
      ',',
      '&a ',
      '*a',
      '!!str ',
      '"q"',
      "'s'",
      '|\n  x\n',
      '# c\n',
      '---\n',
      '...\n',
      'receivers:\n',
      '  - id: r\n',
      '    map: [{pin: 1, ch: 1}]\n',
      'channels: [',
      '{ ch: 1, function: f, role: aux }',
      '\t',
      '~',
      'null',
      '1e999',
      '0x1F',
      '.nan',
      '<<: *a\n',
    );
    fc.assert(
      fc.property(fc.array(pieces, { maxLength: 60 }), (parts) => {
        const analysis = analyzeSetup(parts.join(''));
        expect(typeof analysis.readable).toBe('boolean');
        expect(analysis.counts.errors + analysis.counts.warnings + analysis.counts.infos).toBe(
          analysis.findings.length,
        );
      }),
      { numRuns: 500 },
    );
  });
});
