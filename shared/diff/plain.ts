// Helpers for the plain JSON-like values the diff works on. Documents reach the diff
// from YAML, from the database's jsonb or from a test's generator; none of them is
// trusted to be acyclic, JSON-only or schema-valid, and the diff must never throw.

export type PlainObject = Record<string, unknown>;

export function isPlainObject(value: unknown): value is PlainObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

// A key starting with NUL marks an encoded key; `__proto__` is encoded so that no
// library assigns it as a plain property (which would set a prototype and lose it),
// and keys that already start with NUL get one more so that decoding is exact.
const MARK = '\u0000';

export function encodeKey(key: string): string {
  return key === '__proto__' || key.startsWith(MARK) ? `${MARK}${key}` : key;
}

export function decodeKey(key: string): string {
  return key.startsWith(MARK) ? key.slice(1) : key;
}

// The engine's objects inherit from this empty object, which has no prototype: no key
// meets an inherited property, and unlike objects made by Object.create(null), which V8
// keeps as hash tables, they get the fast property layout of ordinary objects.
const BARE: object = Object.freeze(Object.create(null) as object);

interface CopyOptions {
  bare: boolean;
  key: (key: string) => string;
}

// A fresh JSON-compatible copy: undefined and functions are dropped, cycles become
// null, anything else that JSON cannot carry becomes its string form. A fresh copy
// also means no object is shared between the two sides of a diff, which the
// identity matching relies on.
function copy(value: unknown, options: CopyOptions, seen: object[]): unknown {
  if (value === null) return null;
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return value;
    case 'number':
      return Number.isFinite(value) ? value : String(value);
    case 'bigint':
      return value.toString();
    case 'undefined':
    case 'function':
    case 'symbol':
      return undefined;
  }
  const object = value;
  // `seen` holds the objects being copied around this one (a cycle leads back to one
  // of them): a list, since it is a few levels deep and a set would hash every object.
  if (seen.includes(object)) return null;
  if (object instanceof Date) return Number.isNaN(object.getTime()) ? null : object.toISOString();
  seen.push(object);
  try {
    if (Array.isArray(object)) return object.map((item) => copy(item, options, seen) ?? null);
    const result: PlainObject = options.bare ? (Object.create(BARE) as PlainObject) : {};
    const source = object as PlainObject;
    // Keys then values rather than Object.entries: no pair array per field.
    for (const key of Object.keys(source)) {
      const plain = copy(source[key], options, seen);
      if (plain !== undefined) setOwn(result, options.key(key), plain);
    }
    return result;
  } finally {
    seen.pop();
  }
}

const same = (key: string) => key;

// The form the diff engine works on: objects without a prototype (jsondiffpatch reads
// `right[name]` for every key of the left object, so a key such as `toString` would
// otherwise meet Object.prototype's function and make it throw) and encoded keys.
// `encoded` says the keys are encoded already.
export function toBare(value: unknown, encoded = false): unknown {
  return copy(value, { bare: true, key: encoded ? same : encodeKey }, []);
}

/**
 * toBare in place, for a tree the caller gives up whose values are JSON-compatible
 * already, with encoded keys, no undefined and no object shared or met twice (such as
 * the schema's output for a document that went through toBare): its objects take the
 * engine's prototype instead of being copied.
 */
export function makeBare(value: unknown): unknown {
  if (typeof value !== 'object' || value === null) return value;
  if (Array.isArray(value)) {
    for (const item of value) makeBare(item);
    return value;
  }
  Object.setPrototypeOf(value, BARE);
  for (const key of Object.keys(value)) makeBare((value as PlainObject)[key]);
  return value;
}

/** Back from the engine's form: ordinary objects, keys as the document has them. */
export function fromBare(value: unknown): unknown {
  return copy(value, { bare: false, key: decodeKey }, []);
}

// Loops rather than `every`: the identity matching runs this over every entry of
// both revisions.
export function deepEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let index = 0; index < a.length; index += 1) {
      // `every` skips holes; so does this.
      if (!(index in a)) continue;
      if (!deepEqual(a[index], b[index])) return false;
    }
    return true;
  }
  if (isPlainObject(a) && isPlainObject(b)) {
    const keysA = Object.keys(a);
    const keysB = Object.keys(b);
    if (keysA.length !== keysB.length) return false;
    for (let index = 0; index < keysA.length; index += 1) {
      const key = keysA[index];
      // Fields in the same order (the usual case) need no lookup to be b's own.
      if (key !== keysB[index] && !Object.hasOwn(b, key)) return false;
      if (!deepEqual(a[key], b[key])) return false;
    }
    return true;
  }
  return false;
}

// Key order does not matter, list order does: two objects with the same fields in a
// different order give the same string.
export function stableStringify(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(',')}]`;
  if (isPlainObject(value)) {
    const keys = Object.keys(value).sort();
    return `{${keys.map((key) => `${JSON.stringify(key)}:${stableStringify(value[key])}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

export function withoutKey(value: PlainObject, key: string): PlainObject {
  const rest: PlainObject = {};
  for (const [name, item] of Object.entries(value)) if (name !== key) setOwn(rest, name, item);
  return rest;
}

// A YAML key may well be `__proto__`; plain assignment would change the prototype
// instead of adding a field.
export function setOwn(target: PlainObject, key: string, value: unknown): void {
  if (key === '__proto__')
    Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });
  else target[key] = value;
}
