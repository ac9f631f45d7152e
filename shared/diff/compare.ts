import type { Finding } from '../findings';
import type { Setup } from '../format/schema';
import { changeFindings, type ChangeFinding } from './change-findings';
import { diffDefaulted } from './diff-setups';
import { findingsDelta, type FindingsDelta } from './findings-delta';
import { outputsDelta, type OutputDelta } from './outputs-delta';
import { textDiff, type TextDiff } from './text-diff';
import { toBare, type PlainObject } from './plain';
import type { SetupDiff } from './types';
import { withDefaultsAndSetup } from './with-defaults';

/** One revision as the compare needs it: its text, parsed document and findings. */
export interface CompareSide {
  text: string;
  data: unknown;
  findings: readonly Finding[];
  /** The schema-valid setup when the caller has it already; derived from `data` otherwise. */
  setup?: Setup | null;
}

/**
 * The shape of `compareContent`'s answer. Stored compares (the API's compare cache) are
 * keyed by it: bump it whenever that answer changes (a field added, renamed or computed
 * differently), so no process serves a shape an older build stored.
 */
export const COMPARE_FORMAT_VERSION = 4;

/** What differs between two documents: a function of their content alone (their content hashes). */
export interface ContentComparison extends SetupDiff {
  /** null when either revision is not schema-valid: the bench cannot evaluate it. */
  outputs_delta: OutputDelta[] | null;
  /** Mistakes between the two revisions; null when either is not schema-valid. */
  change_findings: ChangeFinding[] | null;
}

export interface Comparison extends ContentComparison {
  findings_delta: FindingsDelta;
  text: TextDiff;
}

// One validation per side serves the semantic diff (defaults filled in) and the bench
// analyses (the schema-valid setup), unless the caller has the setup already.
function prepared(side: Pick<CompareSide, 'data' | 'setup'>): { document: PlainObject; setup: Setup | null } {
  const { document, setup } = withDefaultsAndSetup(toBare(side.data));
  return { document, setup: side.setup !== undefined ? side.setup : setup };
}

/**
 * The costly part of a compare, which depends on the two documents only. Findings carry
 * line numbers (which move with comments and formatting, not with the content hash) and
 * the text diff depends on the text, so both stay outside it.
 */
export function compareContent(
  before: Pick<CompareSide, 'data' | 'setup'>,
  after: Pick<CompareSide, 'data' | 'setup'>,
): ContentComparison {
  const left = prepared(before);
  const right = prepared(after);
  const valid = left.setup && right.setup ? ([left.setup, right.setup] as const) : null;
  // The diff first: the setups share their entries with the documents, and the diff
  // engine puts into the new one's lists the old one's very objects for the entries it
  // found equal (see diffDocuments), so the outputs search finds those pins' mixes,
  // travels and controls equal at a glance.
  const diff = diffDefaulted(left.document, right.document);
  return {
    ...diff,
    outputs_delta: valid ? outputsDelta(...valid) : null,
    change_findings: valid ? changeFindings(...valid) : null,
  };
}

/** Everything the compare view shows for two revisions (of one model or of two). */
export function compareRevisions(before: CompareSide, after: CompareSide): Comparison {
  return {
    ...compareContent(before, after),
    findings_delta: findingsDelta(before.findings, after.findings),
    text: textDiff(before.text, after.text),
  };
}
