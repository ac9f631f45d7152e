import { Sequelize } from 'sequelize';

// Pool settings keep the server alive while the database is away: connections that
// break are evicted, acquiring one fails fast (503) instead of piling up requests,
// and new connections are tried again on the next request.
export function createSequelize(url: string, options: { logging?: boolean } = {}): Sequelize {
  return new Sequelize(url, {
    dialect: 'postgres',
    logging: options.logging ? (sql) => console.log(sql) : false,
    define: { underscored: true },
    pool: { max: 10, min: 0, idle: 10_000, acquire: 5_000, evict: 1_000 },
    retry: { max: 0 },
    dialectOptions: { connectionTimeoutMillis: 3_000, keepAlive: true, application_name: 'bindery' },
  });
}
