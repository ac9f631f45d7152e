import { z } from 'zod';
import { countFindings, type AnalysisCounts, type Finding, type Severity } from '../findings';
import { CATALOGUE } from '../checks/run-checks';
import { CHANGE_CHECKS } from '../diff/change-findings';

// A club's rules (docs/design.md, club rules): the severity of each check in the
// workspace, and what a sign-off needs. Written once for the API, the screens and the
// command line's `--rules` file, which has this same shape.

export const RULE_SEVERITIES = ['error', 'warning', 'info', 'off'] as const;
export type RuleSeverity = (typeof RULE_SEVERITIES)[number];

const RANK: Record<RuleSeverity, number> = { off: 0, info: 1, warning: 2, error: 3 };

/** Each check's severity as the format defines it, by check id: those of one revision and those across two. */
export const DEFAULT_SEVERITIES: ReadonlyMap<string, Severity> = new Map(
  [...CATALOGUE, ...CHANGE_CHECKS].map((check) => [check.id, check.severity]),
);

export const approvalRulesSchema = z.strictObject({
  default: z.number().int().min(1).max(3),
  heavy_weight_g: z.number().int().positive().max(1_000_000).nullable(),
  heavy: z.number().int().min(1).max(3),
  turbine: z.number().int().min(1).max(3),
  named_reviewers_only: z.boolean(),
});
export type ApprovalRules = z.output<typeof approvalRulesSchema>;

export const clubRulesSchema = z.strictObject({
  severities: z.record(
    z.string().refine((id) => DEFAULT_SEVERITIES.has(id), { message: 'is not a check of docs/format.md' }),
    z.enum(RULE_SEVERITIES),
  ),
  approvals: approvalRulesSchema,
});
export type ClubRules = z.output<typeof clubRulesSchema>;

/** The rules of a club that set none: every check at its own severity, one approval. */
export const DEFAULT_CLUB_RULES: ClubRules = {
  severities: {},
  approvals: { default: 1, heavy_weight_g: null, heavy: 1, turbine: 1, named_reviewers_only: false },
};

/**
 * The checks whose error the rules would lower or switch off. Errors mean "do not fly":
 * a club may make any check stricter, never an error milder.
 */
export function loweredErrors(severities: Readonly<Record<string, RuleSeverity>>): string[] {
  return Object.entries(severities)
    .filter(([id, severity]) => DEFAULT_SEVERITIES.get(id) === 'error' && severity !== 'error')
    .map(([id]) => id);
}

/** What a club rule did to a finding's severity, in the words the screens show. */
export function ruleNote(from: Severity, to: Severity): string {
  return `club rule: ${from} ${RANK[to] > RANK[from] ? 'raised' : 'lowered'} to ${to}`;
}

/**
 * Findings as the club's rules have them: each check's severity replaced by the club's
 * (and noted on the finding), findings of checks switched off left out. A finding raised
 * to an error is no longer accepted: errors cannot be accepted. Findings already
 * carrying a club rule's note are read from their check's own severity again, so the
 * rules in force now always start from the format's.
 */
export function applyClubRules<F extends Pick<Finding, 'rule' | 'severity' | 'accepted' | 'club_rule'>>(
  findings: readonly F[],
  rules: Pick<ClubRules, 'severities'>,
): F[] {
  const result: F[] = [];
  for (const finding of findings) {
    const own = DEFAULT_SEVERITIES.get(finding.rule) ?? finding.severity;
    const wanted = rules.severities[finding.rule];
    const { club_rule: _previous, ...plain } = finding;
    if (wanted === 'off') continue;
    if (wanted === undefined || wanted === own) {
      result.push({ ...plain, severity: own } as F);
      continue;
    }
    const changed = { ...plain, severity: wanted, club_rule: ruleNote(own, wanted) } as F;
    if (wanted === 'error') delete changed.accepted;
    result.push(changed);
  }
  return result;
}

/** Open findings by severity once the club's rules are applied. */
export function ruledCounts(findings: readonly Finding[], rules: Pick<ClubRules, 'severities'>): AnalysisCounts {
  return countFindings(applyClubRules(findings, rules));
}

/** What a model's setup says about its weight and what drives it. */
export interface SignOffFacts {
  weightG: number | null;
  turbine: boolean;
}

export function signOffFacts(data: unknown): SignOffFacts {
  const model = (data as { model?: { weight_g?: unknown; motor?: unknown } } | null)?.model;
  const weight = model && typeof model === 'object' ? model.weight_g : undefined;
  return {
    weightG: typeof weight === 'number' && Number.isFinite(weight) ? weight : null,
    turbine: Boolean(model && typeof model === 'object' && model.motor === 'turbine'),
  };
}

/** Approvals a sign-off needs under the rules: the most that applies of default, heavy and turbine. */
export function approvalsNeeded(approvals: ApprovalRules, facts: SignOffFacts): number {
  let needed = approvals.default;
  if (approvals.heavy_weight_g !== null && facts.weightG !== null && facts.weightG > approvals.heavy_weight_g)
    needed = Math.max(needed, approvals.heavy);
  if (facts.turbine) needed = Math.max(needed, approvals.turbine);
  return needed;
}
