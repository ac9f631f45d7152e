import type { Severity } from '../findings';
import type { ClubRules } from '../rules/club-rules';

/** `GET /api/workspaces/:ws/rules`: the rules in force, each check's own severity, and the changes so far. */
export interface ClubRulesView extends ClubRules {
  /** Each check's severity as the format defines it, by check id. */
  defaults: Record<string, Severity>;
  updated_at: string | null;
  /** Newest first. */
  history: { at: string; actor: { id: string; name: string } | null; before: ClubRules; after: ClubRules }[];
}
