import { describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { toBare } from '@shared/diff/plain';
import { withDefaultsAndSetup } from '@shared/diff/with-defaults';
import { setupSchema } from '@shared/format/schema';
import { makeStressSetup } from '../../fixtures/stress';
import { validFixtures } from './setup-fixtures';

// The compare's document of a valid revision is the schema's output made into the
// engine's form in place (makeBare) rather than copied again (toBare). It must be
// exactly what the copy gave: the same fields in the same order, and no object that
// inherits anything.

function objectsOf(value: unknown, found: object[] = []): object[] {
  if (typeof value !== 'object' || value === null) return found;
  found.push(value);
  for (const item of Array.isArray(value) ? value : Object.values(value)) objectsOf(item, found);
  return found;
}

function inheritsNothing(value: object): boolean {
  if (Array.isArray(value)) return true;
  const prototype = Object.getPrototypeOf(value) as object | null;
  return prototype === null || (Reflect.ownKeys(prototype).length === 0 && Object.getPrototypeOf(prototype) === null);
}

const documents: [string, unknown][] = [
  ...validFixtures().map((fixture) => [fixture.name, analyzeSetup(fixture.text).data] as [string, unknown]),
  ['stress setup', analyzeSetup(makeStressSetup()).data],
];
// Unknown keys are kept, also ones named like Object.prototype's members or __proto__.
const [, first] = documents[0];
documents.push([
  'unknown keys',
  {
    ...(first as object),
    toString: { nested: [1, { constructor: 'x' }] },
    ...JSON.parse('{"__proto__": {"kept": true}}'),
  },
]);

describe('defaults of a valid revision', () => {
  it.each(documents)('%s: the document is the schema output as a copy would give it', (_, data) => {
    const { document, setup } = withDefaultsAndSetup(toBare(data));
    const parsed = setupSchema.parse(toBare(data));
    const copied = toBare({ ...parsed, accepted: parsed.accepted ?? [] }, true);
    expect(setup).not.toBeNull();
    expect(JSON.stringify(document)).toBe(JSON.stringify(copied));
    expect(document).toStrictEqual(copied);
    expect(objectsOf(document).filter((object) => !inheritsNothing(object))).toEqual([]);
    expect(JSON.stringify(setup)).toBe(JSON.stringify(parsed));
  });

  it('two preparations of one document share no object', () => {
    const data = analyzeSetup(makeStressSetup()).data;
    const once = new Set(objectsOf(withDefaultsAndSetup(toBare(data)).document));
    expect(objectsOf(withDefaultsAndSetup(toBare(data)).document).filter((object) => once.has(object))).toEqual([]);
  });
});
