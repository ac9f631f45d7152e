import type { ArrayDelta, Delta, ObjectDelta } from 'jsondiffpatch';
import { diffDocuments, type Matches } from './engine';
import { UNORDERED_LISTS, type ListMatch } from './identity';
import { decodeKey, fromBare, isPlainObject, toBare, type PlainObject } from './plain';
import { summarise, type Draft, type Sides, type Subject, type SubjectType } from './sentences';
import { SECTIONS, emptyCounts, type Change, type Section, type SetupDiff } from './types';
import { withDefaults } from './with-defaults';

const LIST_SUBJECTS: Record<string, SubjectType> = {
  controls: 'control',
  channels: 'channel',
  mixes: 'mix',
  receivers: 'receiver',
  accepted: 'accepted',
};

function sectionOf(key: string): Section {
  return (SECTIONS as readonly string[]).includes(key) && key !== 'other' ? (key as Section) : 'other';
}

function isArrayDelta(delta: Delta): delta is ArrayDelta {
  return isPlainObject(delta) && (delta as PlainObject)._t === 'a';
}

function isStructured(value: unknown): boolean {
  return typeof value === 'object' && value !== null;
}

function at(value: unknown, key: string): unknown {
  return isPlainObject(value) && Object.prototype.hasOwnProperty.call(value, key) ? value[key] : undefined;
}

class Walker {
  readonly drafts: Draft[] = [];

  constructor(private readonly matches: Matches) {}

  root(delta: Delta, left: PlainObject, right: PlainObject): void {
    if (!isPlainObject(delta) || isArrayDelta(delta)) return;
    for (const key of Object.keys(delta)) {
      const section = sectionOf(key);
      const child = delta[key];
      const match = this.matches.lists.get(key);
      if (match && isArrayDelta(child)) {
        this.list(child, left[key] as unknown[], right[key] as unknown[], key, match, {
          type: 'section',
          section,
          name: key,
          left: left[key],
          right: right[key],
        });
        continue;
      }
      const name = decodeKey(key);
      const subject: Subject = { type: 'section', section, name, left: left[key], right: right[key] };
      this.value(child, left[key], right[key], name, subject, []);
    }
  }

  private push(draft: Omit<Draft, 'section'>): void {
    this.drafts.push({ ...draft, section: draft.subject.section });
  }

  private value(delta: Delta, left: unknown, right: unknown, path: string, subject: Subject, field: string[]): void {
    if (delta === undefined) return;
    if (Array.isArray(delta)) {
      if (delta.length === 1) {
        this.push({
          kind: isStructured(delta[0]) ? 'added' : 'changed',
          path,
          before: null,
          after: delta[0],
          subject,
          field,
        });
      } else if (delta.length === 2) {
        this.push({ kind: 'changed', path, before: delta[0], after: delta[1], subject, field });
      } else if (delta[2] === 0) {
        this.push({
          kind: isStructured(delta[0]) ? 'removed' : 'changed',
          path,
          before: delta[0],
          after: null,
          subject,
          field,
        });
      }
      return;
    }
    if (isArrayDelta(delta)) {
      const map =
        subject.type === 'receiver' && field.length === 1 && field[0] === 'map' ? this.mapMatch(subject) : undefined;
      if (map && Array.isArray(left) && Array.isArray(right)) {
        this.list(delta, left, right, path, map, subject, subject);
      } else {
        // Lists without identity keys (rates weights, active positions, unknown lists)
        // are one value each: "rates weights 100/65 -> 100/70 %" reads better than
        // a change per index.
        this.push({ kind: 'changed', path, before: left ?? null, after: right ?? null, subject, field });
      }
      return;
    }
    for (const key of Object.keys(delta)) {
      const name = decodeKey(key);
      this.value(delta[key], at(left, key), at(right, key), `${path}.${name}`, subject, [...field, name]);
    }
  }

  private mapMatch(receiver: Subject): ListMatch | undefined {
    return receiver.index === undefined ? undefined : this.matches.maps.get(receiver.index);
  }

  // `owner` is the list's subject: the section for top-level lists, the receiver for a
  // pin map. Entries are reported in the new list's order, removed ones after them,
  // and one `moved` change per list when the order of the kept entries changed.
  private list(
    delta: ArrayDelta,
    left: unknown[],
    right: unknown[],
    path: string,
    match: ListMatch,
    owner: Subject,
    receiver?: Subject,
  ): void {
    const type: SubjectType = receiver ? 'pin' : LIST_SUBJECTS[owner.name];
    const section = owner.section;
    const entrySubject = (l: unknown, r: unknown, index?: number): Subject => ({
      type,
      section,
      name: owner.name,
      left: l,
      right: r,
      receiver,
      index,
    });
    const movedFrom: number[] = [];
    const removed: number[] = [];
    const updated: number[] = [];
    for (const key of Object.keys(delta)) {
      if (key === '_t') continue;
      const item = (delta as unknown as Record<string, Delta>)[key];
      if (key.startsWith('_')) {
        const index = Number(key.slice(1));
        if (Array.isArray(item) && item[2] === 3) movedFrom.push(index);
        else if (Array.isArray(item) && item[2] === 0) removed.push(index);
      } else {
        updated.push(Number(key));
      }
    }
    for (const j of updated.sort((a, b) => a - b)) {
      const item = (delta as unknown as Record<string, Delta>)[String(j)];
      const entryPath = `${path}${match.rightSegments[j]}`;
      if (Array.isArray(item) && item.length === 1) {
        this.push({
          kind: 'added',
          path: entryPath,
          before: null,
          after: item[0],
          subject: entrySubject(null, item[0]),
          field: [],
        });
        continue;
      }
      const i = match.rightToLeft.get(j);
      const l = i === undefined ? undefined : left[i];
      if (Array.isArray(item)) {
        this.value(item, l, right[j], entryPath, entrySubject(l, right[j]), []);
        continue;
      }
      const subject = entrySubject(l, right[j], j);
      const nested = { ...(item as ObjectDelta) };
      if (match.renamed.has(j) && i !== undefined) {
        this.push({
          kind: 'renamed',
          path: `${path}${match.leftSegments[i]}`,
          before: at(l, match.key),
          after: at(right[j], match.key),
          subject,
          field: [],
        });
        delete nested[match.key];
      }
      this.value(nested, l, right[j], entryPath, subject, []);
    }
    for (const i of removed.sort((a, b) => a - b)) {
      this.push({
        kind: 'removed',
        path: `${path}${match.leftSegments[i]}`,
        before: left[i],
        after: null,
        subject: entrySubject(left[i], null),
        field: [],
      });
    }
    if (movedFrom.length > 0 && !(receiver === undefined && UNORDERED_LISTS.has(owner.name))) {
      this.push({
        kind: 'moved',
        path,
        before: match.leftLabels,
        after: match.rightLabels,
        subject: owner,
        field: [],
        moved: movedFrom.sort((a, b) => a - b).map((i) => match.leftLabels[i]),
      });
    }
  }
}

/**
 * The semantic diff of two setup documents (plain data, schema-valid or not; never
 * throws). Lists are matched by the identity keys of docs/format.md. Each change has a
 * semantic path, the values before and after (null for "none") and a sentence.
 *
 * - added / removed: a list entry, or a section or object field (a cut, a rates
 *   block) that appears or disappears; before / after hold the whole value.
 * - changed: one per scalar leaf (a value set, cleared or altered; null stands for
 *   unset), and lists without identity keys (rates weights) as one value.
 * - renamed: an entry whose identity key changed with the rest of it equal; the path
 *   names the old key, before / after are the old and new key. A channel entry whose
 *   `ch` changed is the function moving channel.
 * - moved: one change per list whose entries' order changed (not one per entry):
 *   order has no effect on outputs, so one line saying which entries moved is
 *   enough; before / after are the entries' keys in the old and new order. The order
 *   of `accepted` means nothing at all and is never a change.
 *
 * Defaults are applied before comparing (see withDefaults). Changes come grouped by
 * section in the order of SECTIONS.
 */
export function diffSetups(before: unknown, after: unknown): SetupDiff {
  return diffDefaulted(withDefaults(toBare(before)), withDefaults(toBare(after)));
}

/** diffSetups of two documents that have been through withDefaults already (fresh copies, owned by the diff). */
export function diffDefaulted(left: PlainObject, right: PlainObject): SetupDiff {
  const { delta, matches } = diffDocuments(left, right);
  const walker = new Walker(matches);
  walker.root(delta, left, right);
  const sides: Sides = { left, right };
  const order = (section: Section) => SECTIONS.indexOf(section);
  const changes: Change[] = walker.drafts
    .map((draft, index) => ({ draft, index }))
    .sort((a, b) => order(a.draft.section) - order(b.draft.section) || a.index - b.index)
    .map(({ draft }) => ({
      kind: draft.kind,
      section: draft.section,
      path: draft.path,
      before: fromBare(draft.before) ?? null,
      after: fromBare(draft.after) ?? null,
      summary: summarise(draft, sides),
    }));
  const counts = emptyCounts();
  const sections = Object.fromEntries(SECTIONS.map((section) => [section, emptyCounts()])) as SetupDiff['sections'];
  for (const change of changes) {
    counts[change.kind] += 1;
    sections[change.section][change.kind] += 1;
  }
  return { changes, counts, sections };
}
