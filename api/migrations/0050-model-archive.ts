import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// Archiving takes a model out of the hangar without deleting anything: its history,
// reviews and exports stay as they were. Who archived it and when is kept beside the
// mark, and the audit trail records each archive and unarchive.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(
      `ALTER TABLE models ADD COLUMN archived_at timestamptz, ADD COLUMN archived_by uuid REFERENCES users (id)`,
    );
    await sql(
      `ALTER TABLE models ADD CONSTRAINT models_archived_shape CHECK ((archived_at IS NULL) = (archived_by IS NULL))`,
    );
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('ALTER TABLE models DROP COLUMN IF EXISTS archived_by, DROP COLUMN IF EXISTS archived_at');
}
