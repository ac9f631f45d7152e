import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(`
      CREATE TABLE receivers (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id),
        label text NOT NULL CHECK (length(label) BETWEEN 1 AND 80),
        -- What is on the case ("Red tape"), and optionally its colour for a swatch beside the words.
        mark text CHECK (length(mark) BETWEEN 1 AND 80),
        mark_colour text CHECK (mark_colour IN ('red', 'orange', 'yellow', 'green', 'blue', 'purple', 'pink', 'white', 'black', 'grey')),
        outputs integer NOT NULL CHECK (outputs BETWEEN 1 AND 32),
        notes text NOT NULL DEFAULT '',
        -- The unit's own last known settings ({ telemetry, pins: [{ pin, ch, failsafe }] }); null when never recorded.
        stored_settings jsonb,
        settings_recorded_at timestamptz,
        created_by uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX receivers_workspace_label ON receivers (workspace_id, lower(label))`);

    // Where each unit has been: a row per stay in a model's receiver slot, from
    // installed_at until removed_at (open while it is still there).
    await sql(`
      CREATE TABLE receiver_installs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        receiver_id uuid NOT NULL REFERENCES receivers (id),
        model_id uuid NOT NULL REFERENCES models (id),
        slot text NOT NULL CHECK (slot ~ '^[a-z0-9][a-z0-9-]{0,39}$'),
        -- The latest revision when it went in: the one its reuse check was run against.
        revision_id uuid REFERENCES revisions (id),
        installed_at timestamptz NOT NULL DEFAULT now(),
        installed_by uuid REFERENCES users (id),
        removed_at timestamptz,
        removed_by uuid REFERENCES users (id),
        CONSTRAINT receiver_installs_order CHECK (removed_at IS NULL OR removed_at >= installed_at)
      )`);
    // A unit is in at most one place, and a slot holds at most one unit, at a time;
    // the database holds to that even for two requests racing each other.
    await sql(
      `CREATE UNIQUE INDEX receiver_installs_one_place ON receiver_installs (receiver_id) WHERE removed_at IS NULL`,
    );
    await sql(
      `CREATE UNIQUE INDEX receiver_installs_one_unit_per_slot ON receiver_installs (model_id, slot) WHERE removed_at IS NULL`,
    );
    await sql(`CREATE INDEX receiver_installs_receiver_history ON receiver_installs (receiver_id, installed_at DESC)`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS receiver_installs, receivers');
}
