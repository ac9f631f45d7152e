import type { Finding } from '../findings';
import { setupSchema, type Setup } from '../format/schema';
import { changeFindings, type ChangeFinding } from './change-findings';
import { diffSetups } from './diff-setups';
import { findingsDelta, type FindingsDelta } from './findings-delta';
import { outputsDelta, type OutputDelta } from './outputs-delta';
import { textDiff, type TextDiff } from './text-diff';
import type { SetupDiff } from './types';

/** One revision as the compare needs it: its text, parsed document and findings. */
export interface CompareSide {
  text: string;
  data: unknown;
  findings: readonly Finding[];
  /** The schema-valid setup when the caller has it already; derived from `data` otherwise. */
  setup?: Setup | null;
}

export interface Comparison extends SetupDiff {
  findings_delta: FindingsDelta;
  /** null when either revision is not schema-valid: the bench cannot evaluate it. */
  outputs_delta: OutputDelta[] | null;
  /** Mistakes between the two revisions; null when either is not schema-valid. */
  change_findings: ChangeFinding[] | null;
  text: TextDiff;
}

function setupOf(side: CompareSide): Setup | null {
  if (side.setup !== undefined) return side.setup;
  const parsed = setupSchema.safeParse(side.data);
  return parsed.success ? parsed.data : null;
}

/** Everything the compare view shows for two revisions (of one model or of two). */
export function compareRevisions(before: CompareSide, after: CompareSide): Comparison {
  const beforeSetup = setupOf(before);
  const afterSetup = setupOf(after);
  return {
    ...diffSetups(before.data, after.data),
    findings_delta: findingsDelta(before.findings, after.findings),
    outputs_delta: beforeSetup && afterSetup ? outputsDelta(beforeSetup, afterSetup) : null,
    change_findings: beforeSetup && afterSetup ? changeFindings(beforeSetup, afterSetup) : null,
    text: textDiff(before.text, after.text),
  };
}
