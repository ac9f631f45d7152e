import { defaultConfig } from '../../../api/config';
import { createSequelize } from '../../../api/db/sequelize';
import { startServer } from '../../../api/server';

// The API in a process of its own for the HTTP benchmarks, so the load generator does
// not share the server's event loop. Prints its address on the first line of stdout.
const url = process.env.BENCH_DATABASE_URL;
const jwtSecret = process.env.BENCH_JWT_SECRET;
if (!url || !jwtSecret) throw new Error('bench-server needs BENCH_DATABASE_URL and BENCH_JWT_SECRET');

const sequelize = createSequelize(url);
const server = await startServer({ sequelize, config: defaultConfig({ jwtSecret }) }, 0);
process.stdout.write(`${server.url}\n`);

process.on('SIGTERM', () => {
  void server
    .close()
    .then(() => sequelize.close())
    .finally(() => process.exit(0));
});
