import { LineCounter } from 'yaml';
import { countFindings, type AnalysisCounts, type Finding } from './findings';
import type { Setup } from './format/schema';
import { runChecks } from './checks/run-checks';
import { readSetupFast } from './parse/fast-read';
import { parseYaml, sizeProblem } from './parse/parse-yaml';

export interface Analysis {
  /** False only when the YAML cannot be parsed at all or its root is not a mapping. */
  readable: boolean;
  /** The plain value of the YAML, unknown keys kept; null when unreadable. */
  data: unknown;
  /** The schema-valid setup with defaults applied; null when there are schema errors. */
  setup: Setup | null;
  /** Sorted by line, then column; accepted ones carry `accepted` (their reason). */
  findings: Finding[];
  /** Open findings by severity; accepted ones apart. */
  counts: AnalysisCounts;
}

/**
 * Reads, validates and checks setup text with the `yaml` package, the reference
 * reader: every finding gets its line and column from the document it builds.
 */
export function analyzeSetupFully(text: string): Analysis {
  const parsed = parseYaml(text);
  const { setup, findings } = runChecks(parsed);
  return { readable: parsed.readable, data: parsed.data, setup, findings, counts: countFindings(findings) };
}

/**
 * The fast reader's analysis when it can read the text and the checks find nothing at
 * all, so no position is ever needed; null otherwise.
 */
export function analyzeSetupFast(text: string): Analysis | null {
  if (sizeProblem(text)) return null;
  const data = readSetupFast(text);
  if (!data) return null;
  const { setup, findings } = runChecks({
    readable: true,
    data,
    document: null,
    lineCounter: new LineCounter(),
    problems: [],
  });
  if (findings.length > 0) return null;
  return { readable: true, data, setup, findings, counts: countFindings(findings) };
}

/** Reads, validates and checks setup text. Pure, never throws, bounded in time. */
export function analyzeSetup(text: string): Analysis {
  return analyzeSetupFast(text) ?? analyzeSetupFully(text);
}
