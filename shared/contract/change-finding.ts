// A finding that exists only between two revisions (second edition, "Checks across two
// revisions"): the API compare, the review and `diff --json` list them as
// `change_findings`. It names the newer revision's path and has no line of its own.
import type { Finding } from '../findings';

export type ChangeFinding = Pick<Finding, 'rule' | 'severity' | 'path' | 'message' | 'hint'>;

/** A comparison that may carry `change_findings` (a server built before them sends none). */
export interface WithChangeFindings {
  change_findings?: ChangeFinding[];
}
