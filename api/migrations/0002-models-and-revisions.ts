import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(`
      CREATE TABLE models (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id),
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 80),
        -- The airframe kind of the latest readable revision; null until one names a known kind.
        airframe text,
        -- Set when the model began as a copy of another model's revision (FK added below).
        forked_from_revision_id uuid,
        created_by uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX models_workspace_name ON models (workspace_id, lower(name))`);

    await sql(`
      CREATE TABLE revisions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        model_id uuid NOT NULL REFERENCES models (id),
        number integer NOT NULL CHECK (number >= 1),
        parent_id uuid REFERENCES revisions (id),
        author_id uuid NOT NULL REFERENCES users (id),
        message text NOT NULL DEFAULT '',
        -- Exactly as sent: downloads answer these bytes.
        yaml_text text NOT NULL,
        document jsonb NOT NULL,
        content_hash text NOT NULL CHECK (content_hash ~ '^[0-9a-f]{64}$'),
        findings jsonb NOT NULL DEFAULT '[]',
        error_count integer NOT NULL DEFAULT 0,
        warning_count integer NOT NULL DEFAULT 0,
        info_count integer NOT NULL DEFAULT 0,
        -- How the revision came to be; a revert or a fork names the revision it copies.
        origin text NOT NULL DEFAULT 'save' CHECK (origin IN ('create', 'save', 'upload', 'revert', 'fork')),
        source_revision_id uuid REFERENCES revisions (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT revisions_model_number_unique UNIQUE (model_id, number),
        CONSTRAINT revisions_parent_shape CHECK ((number = 1) = (parent_id IS NULL)),
        CONSTRAINT revisions_source_shape CHECK ((origin IN ('revert', 'fork')) = (source_revision_id IS NOT NULL))
      )`);
    // The unique constraint's index (model_id, number) serves history pages newest
    // first (read backwards) and the latest-revision lookups.
    await sql(`CREATE INDEX revisions_content_hash ON revisions (content_hash)`);
    await sql(
      `ALTER TABLE models ADD CONSTRAINT models_forked_from_fk FOREIGN KEY (forked_from_revision_id) REFERENCES revisions (id)`,
    );

    // History cannot be rewritten, not even by hand: every UPDATE, DELETE or TRUNCATE
    // of revisions is refused by the database itself.
    await sql(`
      CREATE FUNCTION revisions_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'revisions are immutable: % on revisions is refused', TG_OP
          USING ERRCODE = 'P0001', HINT = 'Save a new revision instead.';
      END
      $$`);
    await sql(
      `CREATE TRIGGER revisions_immutable BEFORE UPDATE OR DELETE ON revisions FOR EACH ROW EXECUTE FUNCTION revisions_refuse_change()`,
    );
    await sql(
      `CREATE TRIGGER revisions_no_truncate BEFORE TRUNCATE ON revisions FOR EACH STATEMENT EXECUTE FUNCTION revisions_refuse_change()`,
    );

    // Numbers are gapless per model and each revision's parent is the one before it.
    // The API serialises saves with a row lock on the model; this holds even for
    // inserts that bypass it (rows inserted earlier in the same statement are visible
    // to a row-level BEFORE trigger, so a bulk insert in order passes).
    await sql(`
      CREATE FUNCTION revisions_check_sequence() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        previous_id uuid;
        previous_number integer;
      BEGIN
        SELECT id, number INTO previous_id, previous_number
          FROM revisions WHERE model_id = NEW.model_id ORDER BY number DESC LIMIT 1;
        IF NEW.number <> coalesce(previous_number, 0) + 1 THEN
          RAISE EXCEPTION 'revision number % breaks the sequence of model % (next is %)', NEW.number, NEW.model_id, coalesce(previous_number, 0) + 1
            USING ERRCODE = '23514';
        END IF;
        IF NEW.parent_id IS DISTINCT FROM previous_id THEN
          RAISE EXCEPTION 'the parent of revision % must be revision %', NEW.number, previous_number USING ERRCODE = '23514';
        END IF;
        RETURN NEW;
      END
      $$`);
    await sql(
      `CREATE TRIGGER revisions_sequence BEFORE INSERT ON revisions FOR EACH ROW EXECUTE FUNCTION revisions_check_sequence()`,
    );

    // Tags are labels on revisions, not revision content, so they may come and go.
    await sql(`
      CREATE TABLE tags (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        model_id uuid NOT NULL REFERENCES models (id),
        revision_id uuid NOT NULL REFERENCES revisions (id),
        name text NOT NULL CHECK (name ~ '^[a-z0-9][a-z0-9-]{0,39}$'),
        created_by uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT tags_model_name_unique UNIQUE (model_id, name)
      )`);
    await sql(`CREATE INDEX tags_revision_id ON tags (revision_id)`);

    await sql(`
      CREATE TABLE audit_events (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id),
        actor_id uuid REFERENCES users (id),
        action text NOT NULL,
        subject_type text NOT NULL,
        subject_id uuid,
        details jsonb NOT NULL DEFAULT '{}',
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX audit_events_workspace_created ON audit_events (workspace_id, created_at DESC, id DESC)`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql('DROP TABLE IF EXISTS audit_events, tags');
    await sql('ALTER TABLE IF EXISTS models DROP CONSTRAINT IF EXISTS models_forked_from_fk');
    await sql('DROP TABLE IF EXISTS revisions, models');
    await sql('DROP FUNCTION IF EXISTS revisions_refuse_change(), revisions_check_sequence()');
  });
}
