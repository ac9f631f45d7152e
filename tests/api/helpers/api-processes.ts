import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

export interface ApiProcess {
  url: string;
  pid: number;
  stop(): Promise<void>;
}

/**
 * Starts scripts/serve-api.ts as a real child process on `databaseUrl` (a free port, no
 * mail server of its own): what each worker of `npm start` runs.
 */
export function startApiProcess(databaseUrl: string, jwtSecret: string): Promise<ApiProcess> {
  const child: ChildProcess = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['scripts/serve-api.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, JWT_SECRET: jwtSecret, PORT: '0', SEED_DEMO: '0' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  return new Promise((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      const match = /listening at (http:\/\/\S+)/.exec(output);
      if (!match) return;
      child.stdout!.off('data', onData);
      resolve({
        url: match[1],
        pid: child.pid!,
        stop: () =>
          new Promise<void>((done) => {
            if (child.exitCode !== null) return done();
            child.once('exit', () => done());
            child.kill('SIGTERM');
          }),
      });
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.once('exit', (code) => reject(new Error(`serve-api exited with ${code} before listening:\n${output}`)));
  });
}
