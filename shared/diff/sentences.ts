import { plainText } from '../parse/plain-text';
import { isPlainObject, type PlainObject } from './plain';
import { quotePair, quoteText } from './quote-text';
import type { ChangeKind, Section } from './types';

// What a change is about: a whole section (model, link, power, format, an unknown
// top-level key) or one entry of an identity-keyed list. `left` / `right` are the
// entry (or section value) on each side, so a sentence can use the pilot's labels.
export type SubjectType = 'section' | 'control' | 'channel' | 'mix' | 'receiver' | 'pin' | 'accepted';

export interface Subject {
  type: SubjectType;
  section: Section;
  /** The top-level key, for sections. */
  name: string;
  left: unknown;
  right: unknown;
  /** The receiver a pin map entry belongs to. */
  receiver?: Subject;
  /** Index of a receiver entry in the new list, which finds its pin map's match. */
  index?: number;
}

export interface Draft {
  kind: ChangeKind;
  section: Section;
  path: string;
  before: unknown;
  after: unknown;
  subject: Subject;
  /** The field inside the subject, e.g. ['travel', 'high_us']; empty for the entry itself. */
  field: string[];
  /** For `moved`: the entries whose place in the list changed. */
  moved?: string[];
}

/** The two whole documents, for looking up what a channel carries on each side. */
export interface Sides {
  left: PlainObject;
  right: PlainObject;
}

interface FieldSpec {
  label: string;
  unit?: string;
  /** Free text a person typed, quoted in sentences; other strings are names and choices. */
  prose?: boolean;
}

const FIELDS: Record<string, Record<string, FieldSpec>> = {
  accepted: { reason: { label: 'reason', prose: true } },
  control: { kind: { label: 'kind' }, positions: { label: 'positions' }, label: { label: 'label', prose: true } },
  channel: {
    function: { label: 'function' },
    role: { label: 'role' },
    side: { label: 'side' },
    travel: { label: 'travel' },
    'travel.low_us': { label: 'travel low end', unit: 'µs' },
    'travel.center_us': { label: 'travel centre', unit: 'µs' },
    'travel.high_us': { label: 'travel high end', unit: 'µs' },
    'travel.reverse': { label: 'reverse' },
    cut: { label: 'cut' },
    'cut.control': { label: 'cut switch' },
    'cut.position': { label: 'cut position' },
    'cut.value': { label: 'cut value', unit: '%' },
  },
  mix: {
    from: { label: 'input' },
    to: { label: 'target channel' },
    weight: { label: 'weight', unit: '%' },
    offset: { label: 'offset', unit: '%' },
    expo: { label: 'expo', unit: '%' },
    rates: { label: 'rates' },
    'rates.control': { label: 'rates switch' },
    'rates.weights': { label: 'rates weights', unit: '%' },
    active: { label: 'active condition' },
    'active.control': { label: 'active switch' },
    'active.positions': { label: 'active in positions' },
  },
  receiver: {
    label: { label: 'label', prose: true },
    role: { label: 'role' },
    outputs: { label: 'outputs' },
    telemetry: { label: 'telemetry' },
    map: { label: 'pin map' },
  },
  pin: { ch: { label: 'channel' }, failsafe: { label: 'failsafe', unit: 'µs' } },
  model: {
    name: { label: 'name', prose: true },
    airframe: { label: 'airframe' },
    wingspan_mm: { label: 'wingspan', unit: 'mm' },
    length_mm: { label: 'length', unit: 'mm' },
    weight_g: { label: 'weight', unit: 'g' },
    notes: { label: 'notes', prose: true },
  },
  link: { channels: { label: 'channels' }, packet_rate_hz: { label: 'packet rate', unit: 'Hz' } },
  power: { receiver_supply: { label: 'receiver supply' } },
};

const SECTION_NAMES: Record<string, string> = {
  model: 'Model',
  link: 'Link',
  power: 'Power',
  format: 'Format',
  accepted: 'Accepted findings',
};
const LIST_NAMES: Record<string, string> = {
  controls: 'Controls',
  channels: 'Channel plan',
  mixes: 'Mixes',
  receivers: 'Receivers',
  accepted: 'Accepted findings',
};

// Document keys reach these tables, so only own entries count (a key named
// `constructor` must not find Object's).
function own<T>(table: Readonly<Record<string, T>>, key: string): T | undefined {
  return Object.prototype.hasOwnProperty.call(table, key) ? table[key] : undefined;
}

// A field the format does not define holds whatever someone wrote, so its text is
// quoted; so is the value of an extra top-level key. A known section's own value is not.
function fieldSpec(subject: Subject, field: string[]): FieldSpec {
  if (subject.type === 'section' && field.length === 0) return { label: '', prose: subject.section === 'other' };
  const table = own(FIELDS, subject.type === 'section' ? subject.name : subject.type);
  return (table && own(table, field.join('.'))) ?? { label: field.join('.'), prose: true };
}

const isText = (value: unknown): value is string => typeof value === 'string' && value !== '';

/** A value in a sentence: typed text quoted, everything else as `text` writes it. */
function shown(value: unknown, spec: FieldSpec): string {
  return spec.prose && isText(value) ? quoteText(value) : text(value);
}

function entry(subject: Subject): PlainObject {
  if (isPlainObject(subject.right)) return subject.right;
  if (isPlainObject(subject.left)) return subject.left;
  return {};
}

function text(value: unknown): string {
  if (value === null || value === undefined) return 'unset';
  if (typeof value === 'boolean') return value ? 'on' : 'off';
  if (typeof value === 'string') return value === '' ? '(empty)' : value;
  if (typeof value === 'number') return String(value);
  if (Array.isArray(value)) return isNumeric(value) ? value.join('/') : `[${value.map(text).join(', ')}]`;
  if (isPlainObject(value)) {
    const entries = Object.entries(value);
    return entries.length === 0 ? 'empty' : entries.map(([key, item]) => `${key} ${text(item)}`).join(', ');
  }
  return plainText(value);
}

function isNumeric(value: unknown): boolean {
  return (
    typeof value === 'number' ||
    (Array.isArray(value) && value.length > 0 && value.every((item) => typeof item === 'number'))
  );
}

function valueWithUnit(value: unknown, spec: FieldSpec, failsafe: boolean): string {
  if (failsafe && (value === null || value === undefined)) return 'unset (receiver default)';
  if (failsafe && value === 'off') return 'off (no pulses)';
  return spec.unit && isNumeric(value) ? `${text(value)} ${spec.unit}` : shown(value, spec);
}

// "1500 -> 988 µs" when both sides are numbers of one unit, else each side with its own.
function beforeAfter(before: unknown, after: unknown, spec: FieldSpec, failsafe = false): string {
  if (spec.unit && isNumeric(before) && isNumeric(after)) return `${text(before)} -> ${text(after)} ${spec.unit}`;
  if (spec.prose && isText(before) && isText(after)) return quotePair(before, after).join(' -> ');
  return `${valueWithUnit(before, spec, failsafe)} -> ${valueWithUnit(after, spec, failsafe)}`;
}

function channelFunctions(doc: PlainObject, ch: unknown): string[] {
  const channels = Array.isArray(doc.channels) ? doc.channels : [];
  return channels
    .filter((item) => isPlainObject(item) && item.ch === ch && typeof item.function === 'string')
    .map((item) => (item as PlainObject).function as string);
}

function channelWithFunction(doc: PlainObject, ch: unknown): string {
  const functions = channelFunctions(doc, ch);
  return functions.length > 0 ? `${text(ch)} (${functions.join(' + ')})` : text(ch);
}

export function receiverName(receiver: Subject): string {
  const value = entry(receiver);
  if (typeof value.label === 'string' && value.label.trim() !== '') return value.label;
  return `Receiver ${text(value.id)}`;
}

function subjectName(subject: Subject, field: string[]): string {
  const value = entry(subject);
  switch (subject.type) {
    case 'control':
      return `Control ${text(value.id)}`;
    case 'mix':
      return `Mix ${text(value.id)}`;
    case 'channel': {
      const fn = typeof value.function === 'string' && field[0] !== 'function' ? ` (${value.function})` : '';
      return `Channel ${text(value.ch)}${fn}`;
    }
    case 'receiver':
      return field[0] === 'label' ? `Receiver ${text(value.id)}` : receiverName(subject);
    case 'pin':
      return `${subject.receiver ? receiverName(subject.receiver) : 'Receiver'} pin ${text(value.pin)}`;
    case 'accepted':
      return `Accepted ${text(value.rule)} at ${value.path === '' ? 'the document' : text(value.path)}`;
    case 'section':
      return own(SECTION_NAMES, subject.name) ?? `Extra field ${subject.name}`;
  }
}

function describeEntry(subject: Subject, value: PlainObject, sides: Sides, side: 'left' | 'right'): string {
  const doc = sides[side];
  switch (subject.type) {
    case 'control': {
      const parts = [text(value.kind)];
      if (value.kind === 'switch') parts.push(`${text(value.positions ?? 2)} positions`);
      if (typeof value.label === 'string')
        parts.push(`labelled ${isText(value.label) ? quoteText(value.label) : text(value.label)}`);
      return parts.join(', ');
    }
    case 'mix': {
      const parts = [`${text(value.from)} -> channel ${channelWithFunction(doc, value.to)}`];
      if (isPlainObject(value.rates))
        parts.push(`rates ${text(value.rates.weights)} % on ${text(value.rates.control)}`);
      else parts.push(`weight ${text(value.weight ?? 100)} %`);
      if (typeof value.expo === 'number' && value.expo !== 0) parts.push(`expo ${value.expo} %`);
      if (typeof value.offset === 'number' && value.offset !== 0) parts.push(`offset ${value.offset} %`);
      if (isPlainObject(value.active))
        parts.push(`only in ${text(value.active.control)} positions ${listText(value.active.positions)}`);
      return parts.join(', ');
    }
    case 'receiver':
      return `${text(value.outputs)} outputs, telemetry ${value.telemetry === false ? 'off' : 'on'}`;
    case 'pin':
      return `channel ${channelWithFunction(doc, value.ch)}, failsafe ${valueWithUnit(value.failsafe, { label: 'failsafe', unit: 'µs' }, true)}`;
    case 'channel':
      return `${text(value.function)} (role ${text(value.role)})`;
    case 'accepted':
      return `reason ${isText(value.reason) ? quoteText(value.reason) : text(value.reason)}`;
    case 'section':
      return text(value);
  }
}

// What a cut, rates or active condition does, in words.
function describeField(subject: Subject, field: string[], value: unknown): string {
  const key = field.join('.');
  if (!isPlainObject(value)) return shown(value, fieldSpec(subject, field));
  if (subject.type === 'channel' && key === 'cut') {
    return `${text(value.control)} at position ${text(value.position)} forces ${text(value.value)} %`;
  }
  if (subject.type === 'mix' && key === 'rates') return `${text(value.weights)} % on ${text(value.control)}`;
  if (subject.type === 'mix' && key === 'active') {
    return `only in ${text(value.control)} positions ${listText(value.positions)}`;
  }
  return text(value);
}

function listText(value: unknown): string {
  return Array.isArray(value) ? value.map(text).join(', ') : text(value);
}

function addedOrRemoved(draft: Draft, sides: Sides): string {
  const { subject, field, kind } = draft;
  const side = kind === 'added' ? 'right' : 'left';
  const value = kind === 'added' ? draft.after : draft.before;
  if (field.length > 0) {
    const spec = fieldSpec(subject, field);
    const name = subject.type === 'section' ? subjectName(subject, field) : `${subjectName(subject, field)}:`;
    const what = describeField(subject, field, value);
    return kind === 'added' ? `${name} ${spec.label} added (${what})` : `${name} ${spec.label} removed (was: ${what})`;
  }
  const item = isPlainObject(value) ? value : {};
  switch (subject.type) {
    case 'channel': {
      const others = channelFunctions(sides.right, item.ch).filter((fn) => fn !== item.function);
      if (kind === 'added') {
        return others.length > 0
          ? `Channel ${text(item.ch)} now also carries ${text(item.function)}`
          : `Channel ${text(item.ch)} added: carries ${describeEntry(subject, item, sides, side)}`;
      }
      return others.length > 0
        ? `Channel ${text(item.ch)} no longer carries ${text(item.function)}`
        : `Channel ${text(item.ch)} (${text(item.function)}) removed`;
    }
    case 'pin': {
      const receiver = subject.receiver ? receiverName(subject.receiver) : 'Receiver';
      return kind === 'added'
        ? `${receiver} pin ${text(item.pin)} added: ${describeEntry(subject, item, sides, side)}`
        : `${receiver} pin ${text(item.pin)} removed (carried channel ${channelWithFunction(sides.left, item.ch)})`;
    }
    case 'section': {
      const name = subject.section === 'other' ? subjectName(subject, field) : `${subjectName(subject, field)} section`;
      const what = shown(value, fieldSpec(subject, field));
      return kind === 'added' ? `${name} added (${what})` : `${name} removed (was: ${what})`;
    }
    default: {
      const name = subjectName(subject, field);
      return kind === 'added' ? `${name} added (${describeEntry(subject, item, sides, side)})` : `${name} removed`;
    }
  }
}

function changed(draft: Draft, sides: Sides): string {
  const { subject, field, before, after } = draft;
  const spec = fieldSpec(subject, field);
  const key = field.join('.');
  let values: string;
  if ((subject.type === 'pin' && key === 'ch') || (subject.type === 'mix' && key === 'to')) {
    values = `${channelWithFunction(sides.left, before)} -> ${channelWithFunction(sides.right, after)}`;
  } else if (subject.type === 'mix' && key === 'active.positions') {
    values = `${listText(before)} -> ${listText(after)}`;
  } else {
    values = beforeAfter(before, after, spec, subject.type === 'pin' && key === 'failsafe');
  }
  if (subject.type === 'section') {
    const name = field.length === 0 ? subjectName(subject, field) : `${subjectName(subject, field)} ${spec.label}`;
    // A quotation is brought in by a colon: "Model notes: “…” -> “…”".
    const quoting = spec.prose && (isText(before) || isText(after));
    return `${name}${quoting ? ':' : ''} ${values}`;
  }
  return `${subjectName(subject, field)}: ${spec.label} ${values}`;
}

function renamed(draft: Draft, sides: Sides): string {
  const { subject, before, after } = draft;
  const value = entry(subject);
  switch (subject.type) {
    case 'channel': {
      const others = channelFunctions(sides.right, after).filter((fn) => fn !== value.function);
      const shared = others.length > 0 ? `, which also carries ${others.join(' + ')}` : '';
      return `Function ${text(value.function)} moved from channel ${text(before)} to channel ${text(after)}${shared}`;
    }
    case 'pin': {
      const receiver = subject.receiver ? receiverName(subject.receiver) : 'Receiver';
      return value.ch === undefined
        ? `${receiver}: pin ${text(before)} renumbered to pin ${text(after)}`
        : `${receiver}: channel ${channelWithFunction(sides.right, value.ch)} moved from pin ${text(before)} to pin ${text(after)}`;
    }
    case 'control':
      return `Control ${text(before)} renamed to ${text(after)}`;
    case 'mix':
      return `Mix ${text(before)} renamed to ${text(after)}`;
    default:
      return `Receiver ${text(before)} renamed to ${text(after)}`;
  }
}

function moved(draft: Draft): string {
  const { subject } = draft;
  const pins = subject.type === 'receiver';
  const list = pins ? `${receiverName(subject)} pin map` : (own(LIST_NAMES, subject.name) ?? subject.name);
  const names = draft.moved ?? [];
  const noun = pins ? 'pin' : subject.name === 'channels' ? 'channel' : '';
  const which =
    names.length === 0 ? '' : `: ${noun ? `${noun}${names.length > 1 ? 's' : ''} ` : ''}${names.join(', ')} moved`;
  return `${list} listed in a new order${which} (list order alone changes nothing)`;
}

export function summarise(draft: Draft, sides: Sides): string {
  switch (draft.kind) {
    case 'added':
    case 'removed':
      return addedOrRemoved(draft, sides);
    case 'changed':
      return changed(draft, sides);
    case 'renamed':
      return renamed(draft, sides);
    case 'moved':
      return moved(draft);
  }
}
