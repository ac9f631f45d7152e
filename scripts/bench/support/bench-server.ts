import { defaultConfig } from '@api/config';
import { createSequelize } from '@api/db/sequelize';
import { startMail } from '@api/mail/start-mail';
import { startServer } from '@api/server';

// The API in a process of its own for the HTTP benchmarks, so the load generator does
// not share the server's event loop. Prints its address on the first line of stdout.
// BENCH_MAIL=1 adds the mail queue's delivery loop and a local mail server, as npm
// start runs them, for the soak's invitations.
const url = process.env.BENCH_DATABASE_URL;
const jwtSecret = process.env.BENCH_JWT_SECRET;
if (!url || !jwtSecret) throw new Error('bench-server needs BENCH_DATABASE_URL and BENCH_JWT_SECRET');

const sequelize = createSequelize(url);
const mail = process.env.BENCH_MAIL === '1' ? await startMail({}, 'http://127.0.0.1', sequelize) : null;
const server = await startServer({ sequelize, config: defaultConfig({ jwtSecret }), mail: mail?.service }, 0);
process.stdout.write(`${server.url}\n`);

process.on('SIGTERM', () => {
  void server
    .close()
    .then(() => mail?.close())
    .then(() => sequelize.close())
    .finally(() => process.exit(0));
});
