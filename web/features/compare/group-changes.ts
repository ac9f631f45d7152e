import { plainText } from '@shared/parse/plain-text';
import {
  CHANGE_KINDS,
  SECTIONS,
  type Change,
  type ChangeCounts,
  type ChangeKind,
  type Section,
} from '@shared/diff/types';

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
  accepted: 'Accepted findings',
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
export function groupChanges(
  changes: readonly Change[],
  sections: Partial<Record<Section, ChangeCounts>>,
): { changed: SectionGroup[]; unchanged: Section[] } {
  const changed: SectionGroup[] = [];
  const unchanged: Section[] = [];
  for (const section of SECTIONS) {
    const inSection = changes.filter((change) => change.section === section);
    const counts = sections[section] ?? countKinds(inSection);
    if (inSection.length === 0 && total(counts) === 0) {
      // Extra keys and accepted findings are optional: most setups have none to be unchanged.
      if (section !== 'other' && section !== 'accepted') unchanged.push(section);
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

const MAX_VALUE_TEXT = 120;

// Like YAML's flow style, the way the setup itself is written: `{ pin: 3, ch: 11 }`.
function flow(value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (Array.isArray(value)) return `[${value.map(flow).join(', ')}]`;
  if (typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).map(([key, item]) => `${key}: ${flow(item)}`);
    return entries.length === 0 ? '{}' : `{ ${entries.join(', ')} }`;
  }
  return plainText(value);
}

/** A before or after value in one line: plain values as they are, entries in flow style, long ones cut short. */
export function valueText(value: unknown): string {
  const text = flow(value);
  return text.length > MAX_VALUE_TEXT ? `${text.slice(0, MAX_VALUE_TEXT - 1)}…` : text;
}
