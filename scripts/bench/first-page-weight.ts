import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { bin } from '../lib/paths';
import { runCommand } from '../lib/run-command';
import type { SizeCheck } from './benchmark';

// The JavaScript a browser must fetch before the first screen renders: the entry
// script of index.html and every chunk it preloads. Lazily loaded screens (the editor,
// compare, the PDF link) are not counted; that is the point of loading them on demand.
async function firstPageKilobytes(): Promise<number> {
  const outDir = mkdtempSync(path.join(os.tmpdir(), 'bindery-weight-'));
  try {
    // The service worker's own build logs whatever the log level says; its lines go to
    // stderr so that `npm run bench -- --json` prints nothing but the JSON on stdout.
    const code = await runCommand(bin('vite'), ['build', '--outDir', outDir, '--logLevel', 'error'], {
      stdio: ['ignore', process.stderr, 'inherit'],
    });
    if (code !== 0) throw new Error(`vite build exited ${code}`);
    const html = readFileSync(path.join(outDir, 'index.html'), 'utf8');
    const scripts = [...html.matchAll(/(?:src|href)="(\/assets\/[^"]+\.js)"/g)].map((match) => match[1]);
    const bytes = scripts.reduce((total, asset) => total + gzipSync(readFileSync(path.join(outDir, asset))).length, 0);
    return bytes / 1024;
  } finally {
    rmSync(outDir, { recursive: true, force: true });
  }
}

export const sizeChecks: SizeCheck[] = [
  { name: "first page's JavaScript, gzipped", budgetKb: 250, measure: firstPageKilobytes },
];
