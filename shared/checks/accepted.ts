import type { Finding } from '../findings';
import type { Setup } from '../format/schema';
import type { CheckResult, ReadCheck } from './check';
import { ref } from './refs';

// `accepted[]` (second edition): warnings and infos the pilot has looked at and
// accepts, matched by rule + path, the entry's identity key. An accepted finding stays
// in the list, marked with its reason, and is counted apart rather than as open. An
// error cannot be accepted ("do not fly this" is not a matter of taste), so an entry
// that names an error is reported itself, by this check, and the error stays open.
export const acceptedError: ReadCheck = {
  id: 'accepted-error',
  severity: 'error',
  description: 'An accepted entry names an error: errors cannot be accepted, only fixed.',
};

// Two entries for one finding (the same rule and path, the entry's identity): only the
// first one's reason is shown, and the compare could not tell the two apart, so the
// second is reported. A warning, not an error: nothing about the model is unsafe.
export const acceptedDuplicate: ReadCheck = {
  id: 'accepted-duplicate',
  severity: 'warning',
  description: 'Two accepted entries name the same rule and path; only the first one counts.',
};

function key(rule: string, path: string): string {
  return `${rule}\u0000${path}`;
}

/** The findings with accepted ones marked, and the results of `accepted-error` and `accepted-duplicate`. */
export function applyAccepted(
  setup: Setup,
  findings: Finding[],
): { findings: Finding[]; results: CheckResult[]; duplicates: CheckResult[] } {
  const entries = setup.accepted ?? [];
  if (entries.length === 0) return { findings, results: [], duplicates: [] };
  const reasons = new Map<string, string>();
  const firstIndex = new Map<string, number>();
  const duplicates: CheckResult[] = [];
  entries.forEach((entry, i) => {
    const id = key(entry.rule, entry.path);
    const first = firstIndex.get(id);
    if (first === undefined) {
      firstIndex.set(id, i);
      reasons.set(id, entry.reason);
      return;
    }
    duplicates.push({
      message: `accepted[${i}] accepts ${entry.rule} at ${entry.path || 'the document'} again, as accepted[${first}] does; only the first entry's reason counts.`,
      hint: 'Keep one entry per rule and path, with the reason you mean.',
      ...ref.root('accepted', i, 'rule'),
      path: `accepted[rule=${entry.rule},path=${entry.path}]`,
    });
  });
  const errors = new Set(findings.filter((f) => f.severity === 'error').map((f) => key(f.rule, f.path)));
  const results: CheckResult[] = [];
  entries.forEach((entry, i) => {
    if (!errors.has(key(entry.rule, entry.path))) return;
    results.push({
      message: `accepted[${i}] accepts ${entry.rule} at ${entry.path || 'the document'}, which is an error: errors cannot be accepted, so it stays open.`,
      hint: 'Fix the error and remove this entry; only warnings and infos can be accepted.',
      ...ref.root('accepted', i, 'rule'),
      path: `accepted[rule=${entry.rule},path=${entry.path}].rule`,
    });
  });
  const marked = findings.map((finding) => {
    if (finding.severity === 'error') return finding;
    const reason = reasons.get(key(finding.rule, finding.path));
    return reason === undefined ? finding : { ...finding, accepted: reason };
  });
  return { findings: marked, results, duplicates };
}
