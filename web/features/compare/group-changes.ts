import { CHANGE_KINDS, SECTIONS, type Change, type ChangeCounts, type ChangeKind, type Section } from '../../../shared/diff/types';

export interface SectionGroup {
  section: Section;
  counts: ChangeCounts;
  total: number;
  changes: Change[];
}

export const SECTION_NAMES: Record<Section, string> = {
  format: 'Format',
  model: 'Model',
  link: 'Link',
  controls: 'Controls',
  channels: 'Channel plan',
  mixes: 'Mixes',
  receivers: 'Receivers and pin maps',
  power: 'Power',
  other: 'Other keys',
};

export const KIND_WORDS: Record<ChangeKind, string> = {
  added: 'Added',
  removed: 'Removed',
  changed: 'Changed',
  renamed: 'Renamed',
  moved: 'Moved',
};

const total = (counts: ChangeCounts) => CHANGE_KINDS.reduce((sum, kind) => sum + counts[kind], 0);

/**
 * The changes by section in the format's order: the sections with changes, and the
 * names of those without, which the view folds into one line.
 */
export function groupChanges(changes: readonly Change[], sections: Partial<Record<Section, ChangeCounts>>): { changed: SectionGroup[]; unchanged: Section[] } {
  const changed: SectionGroup[] = [];
  const unchanged: Section[] = [];
  for (const section of SECTIONS) {
    const inSection = changes.filter((change) => change.section === section);
    const counts = sections[section] ?? countKinds(inSection);
    if (inSection.length === 0 && total(counts) === 0) {
      if (section !== 'other') unchanged.push(section);
      continue;
    }
    changed.push({ section, counts, total: total(counts), changes: inSection });
  }
  return { changed, unchanged };
}

export function countKinds(changes: readonly Change[]): ChangeCounts {
  const counts: ChangeCounts = { added: 0, removed: 0, changed: 0, renamed: 0, moved: 0 };
  for (const change of changes) counts[change.kind]++;
  return counts;
}

/** A before or after value in a line: short values as they are, larger ones as compact JSON. */
export function valueText(value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  const json = JSON.stringify(value);
  return json.length > 120 ? `${json.slice(0, 117)}…` : json;
}
