import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    // Comments become threads: a reply names the thread's first comment (and shares its
    // anchor); only a first comment is resolved or reopened, by a named member.
    await sql(`ALTER TABLE review_comments ADD COLUMN parent_id uuid REFERENCES review_comments (id)`);
    await sql(`ALTER TABLE review_comments ADD COLUMN resolved_at timestamptz`);
    await sql(`ALTER TABLE review_comments ADD COLUMN resolved_by uuid REFERENCES users (id)`);
    await sql(`ALTER TABLE review_comments ADD COLUMN updated_at timestamptz NOT NULL DEFAULT now()`);
    await sql(`
      ALTER TABLE review_comments ADD CONSTRAINT review_comments_resolution_shape
        CHECK ((resolved_at IS NULL) = (resolved_by IS NULL) AND (parent_id IS NULL OR resolved_at IS NULL))`);
    await sql(
      `CREATE INDEX review_comments_parent ON review_comments (parent_id, created_at) WHERE parent_id IS NOT NULL`,
    );

    // What an approval was given with, left undone: the unticked checklist items and the
    // open warnings the approver confirmed they saw. Written once with the verdict
    // (the verdicts table refuses updates).
    await sql(`ALTER TABLE review_verdicts ADD COLUMN left_open jsonb`);

    // A tick carried from an earlier review of the model, because nothing the item
    // covers changed between the two revisions; the reason is said on the review.
    await sql(`ALTER TABLE checklist_ticks ADD COLUMN carried_from_review_id uuid REFERENCES reviews (id)`);
    await sql(`ALTER TABLE checklist_ticks ADD COLUMN carried_reason text`);
    await sql(`
      ALTER TABLE checklist_ticks ADD CONSTRAINT checklist_ticks_carried_shape
        CHECK ((carried_from_review_id IS NULL) = (carried_reason IS NULL))`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(
      'ALTER TABLE checklist_ticks DROP CONSTRAINT checklist_ticks_carried_shape, DROP COLUMN carried_reason, DROP COLUMN carried_from_review_id',
    );
    await sql('ALTER TABLE review_verdicts DROP COLUMN left_open');
    await sql('DROP INDEX IF EXISTS review_comments_parent');
    await sql(
      'ALTER TABLE review_comments DROP CONSTRAINT review_comments_resolution_shape, DROP COLUMN updated_at, DROP COLUMN resolved_by, DROP COLUMN resolved_at, DROP COLUMN parent_id',
    );
  });
}
