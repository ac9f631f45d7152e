import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// A password reset request as the route leaves it: the same one row whether or not an
// account has the address, so the answer's timing cannot tell the two apart. The mail
// delivery loop turns each row into a reset and its queued mail when an account has
// the address, and drops it otherwise (api/mail/reset-requests.ts). `mail` holds the
// outbox columns of the composed message, snake_case, as jsonb_populate_record reads them.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query(`
    CREATE TABLE password_reset_requests (
      id uuid PRIMARY KEY,
      email text NOT NULL CHECK (email = lower(email)),
      expires_at timestamptz NOT NULL,
      mail jsonb NOT NULL,
      requested_at timestamptz NOT NULL DEFAULT now()
    )`);
  await sequelize.query(`CREATE INDEX password_reset_requests_requested ON password_reset_requests (requested_at)`);
  await sequelize.query(`CREATE INDEX password_reset_requests_email ON password_reset_requests (email)`);
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS password_reset_requests');
}
