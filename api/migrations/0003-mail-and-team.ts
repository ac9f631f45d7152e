import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    // What the local mail server caught in development and demo mode; production
    // mail goes to a real SMTP host and never lands here.
    await sql(`
      CREATE TABLE outbox (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        message_id text,
        envelope_from text,
        envelope_to text[] NOT NULL DEFAULT '{}',
        from_header text NOT NULL DEFAULT '',
        to_header text NOT NULL DEFAULT '',
        subject text NOT NULL DEFAULT '',
        text_body text NOT NULL DEFAULT '',
        html_body text,
        size_bytes integer NOT NULL DEFAULT 0,
        received_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX outbox_received ON outbox (received_at DESC, id DESC)`);

    await sql(`
      CREATE TABLE invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        email text NOT NULL CHECK (email = lower(email)),
        role text NOT NULL CHECK (role IN ('owner', 'editor', 'reviewer', 'viewer')),
        invited_by uuid NOT NULL REFERENCES users (id),
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        accepted_by uuid REFERENCES users (id),
        revoked_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT invitations_accepted_shape CHECK ((accepted_at IS NULL) = (accepted_by IS NULL)),
        CONSTRAINT invitations_closed_once CHECK (accepted_at IS NULL OR revoked_at IS NULL)
      )`);
    await sql(`CREATE INDEX invitations_workspace_created ON invitations (workspace_id, created_at DESC)`);
    // One open invitation per address and workspace: inviting again replaces the old one.
    await sql(
      `CREATE UNIQUE INDEX invitations_one_open ON invitations (workspace_id, email) WHERE accepted_at IS NULL AND revoked_at IS NULL`,
    );

    await sql(`
      CREATE TABLE password_resets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await sql(`CREATE INDEX password_resets_user ON password_resets (user_id)`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS password_resets, invitations, outbox');
}
