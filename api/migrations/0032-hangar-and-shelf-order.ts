import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// The hangar and the shelf list a workspace's models and receivers by lower(name) or
// lower(label), then id (so equal names keep one order across pages). Indexes in exactly
// that order let a page be read off the index, with no sort of the whole workspace,
// also pages further on; they replace the indexes without the id.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('CREATE INDEX models_workspace_order ON models (workspace_id, lower(name), id)');
  await sequelize.query('DROP INDEX models_workspace_name');
  await sequelize.query('CREATE INDEX receivers_workspace_order ON receivers (workspace_id, lower(label), id)');
  await sequelize.query('DROP INDEX receivers_workspace_label');
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('CREATE INDEX models_workspace_name ON models (workspace_id, lower(name))');
  await sequelize.query('DROP INDEX models_workspace_order');
  await sequelize.query('CREATE INDEX receivers_workspace_label ON receivers (workspace_id, lower(label))');
  await sequelize.query('DROP INDEX receivers_workspace_order');
}
