import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// Sessions signed out one at a time: a token's id (jti) is kept here until the token's
// own expiry, and every authenticated request checks it. Ending every session at once
// stays the user's session version.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query(`
    CREATE TABLE revoked_sessions (
      jti uuid PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      expires_at timestamptz NOT NULL,
      revoked_at timestamptz NOT NULL DEFAULT now()
    )`);
  await sequelize.query(`CREATE INDEX revoked_sessions_expiry ON revoked_sessions (expires_at)`);
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS revoked_sessions');
}
