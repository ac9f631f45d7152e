#!/usr/bin/env node
// Entry point of `npm start` and `npm test`: plain JavaScript so it runs on a fresh
// clone before any dependency (tsx included) is installed.
import { existsSync } from 'node:fs';
import { spawnSync, spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const [, , target, ...rest] = process.argv;
const targets = { start: 'scripts/start.ts', test: 'scripts/test.ts' };
if (!targets[target]) {
  console.error(`usage: bootstrap.mjs ${Object.keys(targets).join('|')}`);
  process.exit(2);
}

if (!existsSync(path.join(root, 'node_modules', '.bin', 'tsx'))) {
  console.log('Installing dependencies (npm ci)...');
  const install = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (install.status !== 0) process.exit(install.status ?? 1);
}

const child = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), [targets[target], ...rest], {
  cwd: root,
  stdio: 'inherit',
});
// The child handles SIGINT/SIGTERM itself (it owns the database); we only relay.
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
