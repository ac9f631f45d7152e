import type { ProvenanceEntry } from '@shared/contract/provenance';
import { leafValues } from '@shared/lineage/leaf-paths';
import { parseYaml } from '@shared/parse/parse-yaml';
import { parseSemanticPath } from '@shared/parse/semantic-path';
import { locate } from '@shared/parse/source-position';
import { sinceText, type Provenance } from '../provenance/since';

/** The revision a line's settings came from, for the editor's gutter. */
export interface LineOrigin {
  line: number;
  /** "r4" */
  label: string;
  /** "since r4, Hattie, 16 Feb 2025: '…'" */
  title: string;
}

/**
 * Each line of `text` that holds settings, with the revision that last changed them,
 * by identity path (so a pin keeps its origin when lines move above it). Only settings
 * whose value is still the saved revision's count: a line edited since shows nothing.
 * A line holding several settings (a flow map) names the newest change among them.
 */
export function lineOrigins(text: string, savedDocument: unknown, provenance: Provenance): LineOrigin[] {
  const parsed = parseYaml(text);
  if (!parsed.readable || !parsed.document) return [];
  const saved = leafValues(savedDocument);
  const newest = new Map<number, ProvenanceEntry>();
  for (const [path, value] of leafValues(parsed.data)) {
    if (saved.get(path) !== value) continue;
    const entry = provenance.get(path);
    if (!entry) continue;
    const { line } = locate(parsed.document, parsed.lineCounter, parseSemanticPath(path));
    const known = newest.get(line);
    if (!known || entry.created_at > known.created_at) newest.set(line, entry);
  }
  return [...newest.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([line, entry]) => ({ line, label: `r${entry.revision.number}`, title: sinceText(entry) }));
}

/** The status line under the editor for the cursor's line: the gutter mark's detail, in words. */
export function cursorOriginText(line: number, origin: LineOrigin | null): string {
  return `Line ${line}: ${origin ? origin.title : 'no saved setting on this line'}`;
}
