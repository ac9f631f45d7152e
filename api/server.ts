import type { Server } from 'node:http';
import { createApp } from './app';
import type { AppContext } from './context';
import { startImportWorker } from './portability/import-worker';
import { settleRecordings } from './provenance/record-later';

export interface RunningServer {
  server: Server;
  url: string;
  close(): Promise<void>;
}

export const DEFAULT_PORT = 3000;

export function portFromEnv(env: NodeJS.ProcessEnv): number {
  const raw = env.PORT ?? String(DEFAULT_PORT);
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be a port number, got "${raw}"`);
  return port;
}

/** Listens on 127.0.0.1; port 0 takes a free one (see `url`). Runs the history import worker beside it. */
export function startServer(context: AppContext, port: number, host = '127.0.0.1'): Promise<RunningServer> {
  const app = createApp(context);
  const worker = startImportWorker(context.sequelize, { logErrors: context.config.logErrors });
  return new Promise((resolve, reject) => {
    const server = app.listen(port, host);
    server.once('error', (error: NodeJS.ErrnoException) => {
      void worker.stop();
      reject(
        error.code === 'EADDRINUSE'
          ? new Error(`Port ${port} on ${host} is already in use: stop what uses it or set PORT to another port.`)
          : error,
      );
    });
    server.once('listening', () => {
      const address = server.address();
      const actual = typeof address === 'object' && address ? address.port : port;
      resolve({
        server,
        url: `http://${host}:${actual}`,
        close: async () => {
          await new Promise<void>((done, fail) => {
            server.close((error) => (error ? fail(error) : done()));
            server.closeAllConnections();
          });
          // The job in hand and the provenance of the last saves finish (or fail) before
          // the database goes away.
          await Promise.all([worker.stop(), settleRecordings(context.sequelize)]);
        },
      });
    });
  });
}
