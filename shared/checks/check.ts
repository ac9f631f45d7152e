import type { Severity } from '../findings';
import type { Setup } from '../format/schema';
import type { DataPath } from '../parse/semantic-path';
import type { CheckContext } from './context';

/** What a check reports; the runner adds the rule id, severity and source position. */
export interface CheckResult {
  message: string;
  hint: string;
  /** Semantic path, e.g. `receivers[id=wing].map[pin=3].failsafe`. */
  path: string;
  /**
   * The data path of the offending node when the semantic path is ambiguous (a second
   * entry with a duplicated identity) or to save the runner resolving it.
   */
  at?: DataPath;
}

/** A check of a schema-valid setup. */
export interface Check {
  id: string;
  severity: Severity;
  description: string;
  check(doc: Setup, ctx: CheckContext): CheckResult[];
}

/** A check of the plain data of any readable document, valid or not. */
export interface DataCheck {
  id: string;
  severity: Severity;
  description: string;
  check(doc: unknown): CheckResult[];
}

/** The two checks that come from reading the text and validating it. */
export interface ReadCheck {
  id: string;
  severity: Severity;
  description: string;
}
