export const CHANGE_KINDS = ['added', 'removed', 'changed', 'renamed', 'moved'] as const;
export type ChangeKind = (typeof CHANGE_KINDS)[number];

// The compare view groups changes by these; `other` holds top-level keys the format
// does not define.
export const SECTIONS = [
  'format',
  'model',
  'link',
  'controls',
  'channels',
  'mixes',
  'receivers',
  'power',
  'accepted',
  'other',
] as const;
export type Section = (typeof SECTIONS)[number];

export interface Change {
  kind: ChangeKind;
  section: Section;
  /** Semantic path with identity keys, e.g. `receivers[id=wing].map[pin=3].failsafe`. */
  path: string;
  /** null where the side has no value (an added entry's before, a field that was unset). */
  before: unknown;
  after: unknown;
  /** A plain sentence a pilot understands. */
  summary: string;
}

export type ChangeCounts = Record<ChangeKind, number>;

export interface SetupDiff {
  changes: Change[];
  counts: ChangeCounts;
  /** Every section, zero counts included, so a view can list them in a fixed order. */
  sections: Record<Section, ChangeCounts>;
}

export function emptyCounts(): ChangeCounts {
  return { added: 0, removed: 0, changed: 0, renamed: 0, moved: 0 };
}
