import type { Finding, Severity } from '../findings';
import type { Setup } from '../format/schema';
import type { ParsedText } from '../parse/parse-yaml';
import { dataPathSteps, parseSemanticPath } from '../parse/semantic-path';
import { locate } from '../parse/source-position';
import type { Check, CheckResult, DataCheck, ReadCheck } from './check';
import { buildContext } from './context';
import { duplicateId } from './duplicate-id';
import { channelShared } from './channel-shared';
import { channelBeyondLink } from './channel-beyond-link';
import { pinBeyondOutputs } from './pin-beyond-outputs';
import { functionUnrouted } from './function-unrouted';
import { pinUndriven } from './pin-undriven';
import { channelUndriven } from './channel-undriven';
import { unknownControl } from './unknown-control';
import { controlNotSwitch } from './control-not-switch';
import { positionOutOfRange } from './position-out-of-range';
import { mixUnplannedTarget } from './mix-unplanned-target';
import { mixSaturates } from './mix-saturates';
import { travelOrder } from './travel-order';
import { pulseOutOfRange } from './pulse-out-of-range';
import { telemetryMultiple } from './telemetry-multiple';
import { telemetryNone } from './telemetry-none';
import { primaryCount } from './primary-count';
import { failsafeThrottle } from './failsafe-throttle';
import { failsafeEndstop } from './failsafe-endstop';
import { failsafeUnset } from './failsafe-unset';
import { motorWithoutCut } from './motor-without-cut';
import { heavyModelFailsafe } from './heavy-model-failsafe';
import { pairSplit } from './pair-split';
import { primaryControlsOnSecondary } from './primary-controls-on-secondary';
import { powerDoubleSupply } from './power-double-supply';
import { controlUnused } from './control-unused';
import { failsafeNoPulses } from './failsafe-no-pulses';
import { failsafePayload } from './failsafe-payload';
import { failsafeMismatch } from './failsafe-mismatch';
import { telemetryOnSecondary } from './telemetry-on-secondary';
import { primaryDisabledBySwitch } from './primary-disabled-by-switch';
import { cutNotAtStop } from './cut-not-at-stop';
import { acceptedDuplicate, acceptedError, applyAccepted } from './accepted';
import { schema, validateSetup } from './schema';
import { syntax } from './syntax';
import { unknownKey } from './unknown-key';

/** The semantic checks, run on schema-valid setups, in docs/format.md's catalogue order. */
export const SETUP_CHECKS: readonly Check[] = [
  duplicateId,
  channelShared,
  channelBeyondLink,
  pinBeyondOutputs,
  functionUnrouted,
  pinUndriven,
  channelUndriven,
  unknownControl,
  controlNotSwitch,
  positionOutOfRange,
  mixUnplannedTarget,
  mixSaturates,
  travelOrder,
  pulseOutOfRange,
  telemetryMultiple,
  telemetryNone,
  primaryCount,
  failsafeThrottle,
  failsafeEndstop,
  failsafeUnset,
  motorWithoutCut,
  heavyModelFailsafe,
  pairSplit,
  primaryControlsOnSecondary,
  powerDoubleSupply,
  controlUnused,
  // Second edition of the safety model, in docs/format.md's order.
  failsafeNoPulses,
  failsafePayload,
  failsafeMismatch,
  telemetryOnSecondary,
  primaryDisabledBySwitch,
  cutNotAtStop,
];

/** Every check in the catalogue, for documentation and the client. */
export const CATALOGUE: readonly (ReadCheck | DataCheck | Check)[] = [
  syntax,
  schema,
  unknownKey,
  ...SETUP_CHECKS,
  acceptedError,
  acceptedDuplicate,
];

export interface CheckRun {
  setup: Setup | null;
  findings: Finding[];
}

function toFinding(parsed: ParsedText, rule: string, severity: Severity, result: CheckResult): Finding {
  const steps = result.at ? dataPathSteps(result.at) : parseSemanticPath(result.path);
  const { line, column } = parsed.document
    ? locate(parsed.document, parsed.lineCounter, steps)
    : { line: 1, column: 1 };
  return { rule, severity, message: result.message, hint: result.hint, path: result.path, line, column };
}

function byPosition(a: Finding, b: Finding): number {
  return a.line - b.line || a.column - b.column;
}

/** Runs the whole catalogue on parsed text: syntax, then schema and unknown keys, then the semantic checks. */
export function runChecks(parsed: ParsedText): CheckRun {
  if (!parsed.readable) {
    const findings = parsed.problems.map((problem) => ({
      rule: syntax.id,
      severity: syntax.severity,
      message: problem.message,
      hint: problem.hint,
      path: '',
      line: problem.line,
      column: problem.column,
    }));
    return { setup: null, findings: findings.sort(byPosition) };
  }

  const findings: Finding[] = [];
  const { setup, results } = validateSetup(parsed.data);
  for (const result of results) findings.push(toFinding(parsed, schema.id, schema.severity, result));
  for (const result of unknownKey.check(parsed.data))
    findings.push(toFinding(parsed, unknownKey.id, unknownKey.severity, result));
  if (setup) {
    const ctx = buildContext(setup);
    for (const check of SETUP_CHECKS) {
      for (const result of check.check(setup, ctx)) findings.push(toFinding(parsed, check.id, check.severity, result));
    }
    const accepted = applyAccepted(setup, findings);
    for (const result of accepted.results)
      accepted.findings.push(toFinding(parsed, acceptedError.id, acceptedError.severity, result));
    for (const result of accepted.duplicates)
      accepted.findings.push(toFinding(parsed, acceptedDuplicate.id, acceptedDuplicate.severity, result));
    return { setup, findings: accepted.findings.sort(byPosition) };
  }
  return { setup, findings: findings.sort(byPosition) };
}
