import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// The outbox becomes the mail queue: commands insert a pending row inside their own
// transaction, and the delivery loop (api/mail/delivery.ts) sends it after commit, with
// retries. Rows caught before this migration were delivered by definition.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(`
      ALTER TABLE outbox
        ADD COLUMN state text NOT NULL DEFAULT 'delivered' CHECK (state IN ('pending', 'delivered', 'failed')),
        ADD COLUMN attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
        ADD COLUMN next_attempt_at timestamptz,
        ADD COLUMN last_error text,
        ADD COLUMN queued_at timestamptz NOT NULL DEFAULT now(),
        ADD COLUMN delivered_at timestamptz,
        ADD CONSTRAINT outbox_pending_is_scheduled CHECK ((state = 'pending') = (next_attempt_at IS NOT NULL))`);
    await sql(`UPDATE outbox SET queued_at = received_at, delivered_at = received_at`);
    // received_at is when the local mail server caught the message; a queued one has not been.
    await sql(`ALTER TABLE outbox ALTER COLUMN received_at DROP NOT NULL, ALTER COLUMN received_at DROP DEFAULT`);
    await sql(`ALTER TABLE outbox ALTER COLUMN state SET DEFAULT 'pending'`);
    await sql(`CREATE INDEX outbox_queued ON outbox (queued_at DESC, id DESC)`);
    await sql(`CREATE INDEX outbox_due ON outbox (next_attempt_at) WHERE state = 'pending'`);
    await sql(`CREATE INDEX outbox_message_id ON outbox (message_id) WHERE message_id IS NOT NULL`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(`DROP INDEX IF EXISTS outbox_message_id`);
    await sql(`DROP INDEX IF EXISTS outbox_due`);
    await sql(`DROP INDEX IF EXISTS outbox_queued`);
    await sql(`DELETE FROM outbox WHERE received_at IS NULL`);
    await sql(`ALTER TABLE outbox ALTER COLUMN received_at SET DEFAULT now(), ALTER COLUMN received_at SET NOT NULL`);
    await sql(`
      ALTER TABLE outbox
        DROP CONSTRAINT outbox_pending_is_scheduled,
        DROP COLUMN state, DROP COLUMN attempts, DROP COLUMN next_attempt_at, DROP COLUMN last_error,
        DROP COLUMN queued_at, DROP COLUMN delivered_at`);
  });
}
