import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    // A fork taking in its source's newer revisions saves a `merge` revision that names
    // the source revision it took in, so the next merge starts from there.
    await sql(`ALTER TABLE revisions DROP CONSTRAINT revisions_origin_check`);
    await sql(
      `ALTER TABLE revisions ADD CONSTRAINT revisions_origin_check CHECK (origin IN ('create', 'save', 'upload', 'revert', 'fork', 'merge'))`,
    );
    await sql(`ALTER TABLE revisions DROP CONSTRAINT revisions_source_shape`);
    await sql(
      `ALTER TABLE revisions ADD CONSTRAINT revisions_source_shape CHECK ((origin IN ('revert', 'fork', 'merge')) = (source_revision_id IS NOT NULL))`,
    );

    // The leaf settings each revision changed, by identity path: where a value came from
    // is the newest row for its path at or below a revision's number, one index lookup.
    // A value that came with a fork or a merge from the source names the source's
    // revision that set it (origin_revision_id). Derived data, computed once per
    // revision; rows of revisions saved before this table existed are computed the
    // first time they are needed (provenance_progress says how far each model is).
    await sql(`
      CREATE TABLE revision_changes (
        model_id uuid NOT NULL REFERENCES models (id),
        path text NOT NULL,
        number integer NOT NULL,
        revision_id uuid NOT NULL REFERENCES revisions (id),
        origin_revision_id uuid REFERENCES revisions (id),
        PRIMARY KEY (model_id, path, number)
      )`);
    await sql(`
      CREATE TABLE provenance_progress (
        model_id uuid PRIMARY KEY REFERENCES models (id),
        through_number integer NOT NULL CHECK (through_number >= 0)
      )`);

    // A club's rules: the severity of each check and what a sign-off needs. One row per
    // workspace that set any; every change is an audit event with the before and after.
    await sql(`
      CREATE TABLE club_rules (
        workspace_id uuid PRIMARY KEY REFERENCES workspaces (id),
        severities jsonb NOT NULL DEFAULT '{}',
        approvals jsonb NOT NULL,
        updated_by uuid NOT NULL REFERENCES users (id),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql('DROP TABLE club_rules');
    await sql('DROP TABLE provenance_progress');
    await sql('DROP TABLE revision_changes');
    await sql(`ALTER TABLE revisions DROP CONSTRAINT revisions_source_shape`);
    await sql(
      `ALTER TABLE revisions ADD CONSTRAINT revisions_source_shape CHECK ((origin IN ('revert', 'fork')) = (source_revision_id IS NOT NULL))`,
    );
    await sql(`ALTER TABLE revisions DROP CONSTRAINT revisions_origin_check`);
    await sql(
      `ALTER TABLE revisions ADD CONSTRAINT revisions_origin_check CHECK (origin IN ('create', 'save', 'upload', 'revert', 'fork'))`,
    );
  });
}
