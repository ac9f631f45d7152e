import { countFindings, type Finding, type FindingCounts } from './findings';
import type { Setup } from './format/schema';
import { runChecks } from './checks/run-checks';
import { parseYaml } from './parse/parse-yaml';

export interface Analysis {
  /** False only when the YAML cannot be parsed at all or its root is not a mapping. */
  readable: boolean;
  /** The plain value of the YAML, unknown keys kept; null when unreadable. */
  data: unknown | null;
  /** The schema-valid setup with defaults applied; null when there are schema errors. */
  setup: Setup | null;
  /** Sorted by line, then column. */
  findings: Finding[];
  counts: FindingCounts;
}

/** Reads, validates and checks setup text. Pure, never throws, bounded in time. */
export function analyzeSetup(text: string): Analysis {
  const parsed = parseYaml(text);
  const { setup, findings } = runChecks(parsed);
  return { readable: parsed.readable, data: parsed.data, setup, findings, counts: countFindings(findings) };
}
