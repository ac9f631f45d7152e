import { QueryTypes, Sequelize } from 'sequelize';

// Creating and dropping whole databases on a server: the embedded cluster's own
// database, and the per-file test databases cloned from a migrated template.

export function quoteIdentifier(name: string): string {
  if (!/^[A-Za-z_][A-Za-z0-9_-]*$/.test(name)) throw new Error(`Not a plain database name: ${name}`);
  return `"${name}"`;
}

/** The same server and credentials, another database. */
export function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${encodeURIComponent(database)}`;
  return parsed.toString();
}

/** Runs `work` on a short-lived single connection to the server's maintenance database. */
export async function withMaintenanceConnection<T>(
  serverUrl: string,
  work: (admin: Sequelize) => Promise<T>,
): Promise<T> {
  const admin = new Sequelize(withDatabase(serverUrl, 'postgres'), {
    dialect: 'postgres',
    logging: false,
    pool: { max: 1, min: 0 },
  });
  try {
    return await work(admin);
  } finally {
    await admin.close();
  }
}

export async function createDatabase(
  serverUrl: string,
  name: string,
  options: { template?: string; ifMissing?: boolean } = {},
): Promise<void> {
  await withMaintenanceConnection(serverUrl, async (admin) => {
    if (options.ifMissing) {
      const found = await admin.query('SELECT 1 FROM pg_database WHERE datname = $name', {
        bind: { name },
        type: QueryTypes.SELECT,
      });
      if (found.length > 0) return;
    }
    const from = options.template ? ` TEMPLATE ${quoteIdentifier(options.template)}` : '';
    await admin.query(`CREATE DATABASE ${quoteIdentifier(name)}${from}`);
  });
}

export async function dropDatabase(serverUrl: string, name: string): Promise<void> {
  await withMaintenanceConnection(serverUrl, (admin) =>
    admin.query(`DROP DATABASE IF EXISTS ${quoteIdentifier(name)} WITH (FORCE)`),
  );
}
