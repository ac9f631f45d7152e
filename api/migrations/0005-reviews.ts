import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    // A request for sign-off of one revision. model_id and workspace_id repeat what the
    // revision says so lists and the model's review state need no join through it.
    await sql(`
      CREATE TABLE reviews (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        revision_id uuid NOT NULL REFERENCES revisions (id),
        model_id uuid NOT NULL REFERENCES models (id),
        workspace_id uuid NOT NULL REFERENCES workspaces (id),
        requested_by uuid NOT NULL REFERENCES users (id),
        reviewer_ids uuid[] NOT NULL CHECK (cardinality(reviewer_ids) BETWEEN 1 AND 20),
        note text NOT NULL DEFAULT '',
        state text NOT NULL DEFAULT 'open' CHECK (state IN ('open', 'approved', 'changes-requested')),
        decided_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT reviews_decided_shape CHECK ((state = 'open') = (decided_at IS NULL))
      )`);
    await sql(`CREATE INDEX reviews_workspace_created ON reviews (workspace_id, created_at DESC, id DESC)`);
    await sql(`CREATE INDEX reviews_model ON reviews (model_id)`);
    await sql(`CREATE INDEX reviews_revision ON reviews (revision_id)`);
    await sql(`CREATE INDEX reviews_reviewers ON reviews USING gin (reviewer_ids)`);

    // A verdict is a signature: pinned to the content hash it was given on and never
    // changed afterwards (a later verdict supersedes it instead).
    await sql(`
      CREATE TABLE review_verdicts (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        review_id uuid NOT NULL REFERENCES reviews (id),
        reviewer_id uuid NOT NULL REFERENCES users (id),
        verdict text NOT NULL CHECK (verdict IN ('approve', 'request-changes', 'comment')),
        body text NOT NULL DEFAULT '',
        content_hash text NOT NULL CHECK (content_hash ~ '^[0-9a-f]{64}$'),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX review_verdicts_review ON review_verdicts (review_id, created_at)`);
    await sql(`CREATE INDEX review_verdicts_hash ON review_verdicts (content_hash) WHERE verdict = 'approve'`);
    await sql(`
      CREATE FUNCTION review_verdicts_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'verdicts are permanent: % on review_verdicts is refused', TG_OP
          USING ERRCODE = 'P0001', HINT = 'Give a new verdict instead.';
      END
      $$`);
    await sql(
      `CREATE TRIGGER review_verdicts_immutable BEFORE UPDATE OR DELETE ON review_verdicts FOR EACH ROW EXECUTE FUNCTION review_verdicts_refuse_change()`,
    );

    // Comments belong to a revision (and to the review they were made in, if any); an
    // anchored one names a semantic path, e.g. receivers[id=wing].map[pin=3].
    await sql(`
      CREATE TABLE review_comments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        review_id uuid REFERENCES reviews (id),
        revision_id uuid NOT NULL REFERENCES revisions (id),
        model_id uuid NOT NULL REFERENCES models (id),
        path text CHECK (path IS NULL OR length(path) BETWEEN 1 AND 300),
        body text NOT NULL CHECK (length(body) BETWEEN 1 AND 4000),
        author_id uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX review_comments_model ON review_comments (model_id, created_at)`);
    await sql(`CREATE INDEX review_comments_review ON review_comments (review_id)`);

    await sql(`
      CREATE TABLE checklist_ticks (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        review_id uuid NOT NULL REFERENCES reviews (id),
        item text NOT NULL,
        ticked_by uuid NOT NULL REFERENCES users (id),
        ticked_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT checklist_ticks_review_item_unique UNIQUE (review_id, item)
      )`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql('DROP TABLE IF EXISTS checklist_ticks, review_comments, review_verdicts, reviews');
    await sql('DROP FUNCTION IF EXISTS review_verdicts_refuse_change()');
  });
}
