import {
  DataTypes,
  Model,
  QueryTypes,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
  type Transaction,
} from 'sequelize';
import {
  DEFAULT_CLUB_RULES,
  type ApprovalRules,
  type ClubRules as Rules,
  type RuleSeverity,
} from '@shared/rules/club-rules';
import type { User } from './User';
import type { Workspace } from './Workspace';

/** A workspace's club rules (migration 0070); a workspace without a row follows the defaults. */
export class ClubRules extends Model<InferAttributes<ClubRules>, InferCreationAttributes<ClubRules>> {
  declare workspaceId: Workspace['id'];
  declare severities: Record<string, RuleSeverity>;
  declare approvals: ApprovalRules;
  declare updatedBy: User['id'];
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize): void {
    ClubRules.init(
      {
        workspaceId: { type: DataTypes.UUID, primaryKey: true },
        severities: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        approvals: { type: DataTypes.JSONB, allowNull: false },
        updatedBy: { type: DataTypes.UUID, allowNull: false },
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'club_rules', modelName: 'ClubRules', underscored: true, createdAt: false },
    );
  }
}

/** The rules in force now in a workspace. */
export async function rulesOf(workspaceId: string, transaction?: Transaction): Promise<Rules> {
  const row = await ClubRules.findByPk(workspaceId, { transaction });
  return row
    ? { severities: row.severities, approvals: { ...DEFAULT_CLUB_RULES.approvals, ...row.approvals } }
    : DEFAULT_CLUB_RULES;
}

/** The rules in force now for each given model's workspace, by model id; only models whose club set rules. */
export async function rulesByModel(
  modelIds: readonly string[],
  transaction?: Transaction,
): Promise<Map<string, Rules>> {
  if (modelIds.length === 0) return new Map();
  const rows = await ClubRules.sequelize!.query<{
    model_id: string;
    severities: Rules['severities'];
    approvals: ApprovalRules;
  }>(
    `SELECT m.id AS model_id, c.severities, c.approvals FROM models m JOIN club_rules c ON c.workspace_id = m.workspace_id
      WHERE m.id = ANY($ids::uuid[])`,
    { bind: { ids: [...new Set(modelIds)] }, type: QueryTypes.SELECT, transaction },
  );
  return new Map(
    rows.map((row) => [
      row.model_id,
      { severities: row.severities, approvals: { ...DEFAULT_CLUB_RULES.approvals, ...row.approvals } },
    ]),
  );
}
