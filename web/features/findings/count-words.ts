import type { AnalysisCounts, FindingCounts } from '@shared/findings';

// The checks' counts in words, with the same words as the badges (the format's `info`
// severity is a "note" on every screen): "1 error, 2 warnings, 0 notes".

const counted = (count: number, word: string): string => `${count} ${count === 1 ? word : `${word}s`}`;

/** "1 error, 1 warning, 0 notes", and "(2 accepted)" when some are accepted. */
export function countWords(counts: FindingCounts & Partial<Pick<AnalysisCounts, 'accepted'>>): string {
  const open = [
    counted(counts.errors, 'error'),
    counted(counts.warnings, 'warning'),
    counted(counts.infos, 'note'),
  ].join(', ');
  return counts.accepted ? `${open} (${counts.accepted} accepted)` : open;
}

/** "2 warnings and 1 note", naming only what there is; null when there is nothing. */
export function someCountWords(counts: FindingCounts): string | null {
  const parts = [
    counts.errors > 0 && counted(counts.errors, 'error'),
    counts.warnings > 0 && counted(counts.warnings, 'warning'),
    counts.infos > 0 && counted(counts.infos, 'note'),
  ].filter((part): part is string => typeof part === 'string');
  if (parts.length === 0) return null;
  return parts.length === 1 ? parts[0] : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}
