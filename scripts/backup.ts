// npm run backup [-- --output FILE]: a pg_dump (custom format, compressed) of the
// project's database (DATABASE_URL, or npm start's own cluster) into
// backups/bindery-<UTC time>.dump. npm run restore -- FILE --yes puts it back.
import { mkdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { countRecords, formatCounts, openBackupTarget, runClient } from './lib/backup-database';
import { projectRoot } from './lib/paths';

const stamp = (when: Date): string =>
  when
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/:/g, '-');

async function main(): Promise<number> {
  const { values } = parseArgs({ options: { output: { type: 'string', short: 'o' } } });
  const file = path.resolve(values.output ?? path.join(projectRoot, 'backups', `bindery-${stamp(new Date())}.dump`));
  mkdirSync(path.dirname(file), { recursive: true });
  const target = await openBackupTarget((line) => console.log(line));
  try {
    const counts = await countRecords(target.url);
    const result = await runClient(target.binDir, 'pg_dump', [
      '--format=custom',
      '--compress=6',
      '--no-password',
      `--file=${file}`,
      `--dbname=${target.url}`,
    ]);
    if (result.code !== 0) {
      console.error(`pg_dump failed (exit ${result.code}):\n${result.output.trim()}`);
      return 1;
    }
    console.log(`Backed up ${target.label} (${formatCounts(counts)})`);
    console.log(`to ${file} (${Math.ceil(statSync(file).size / 1024)} KB).`);
    const shown = path.relative(process.cwd(), file);
    console.log(`Restore it with: npm run restore -- ${shown.startsWith('..') ? file : shown} --yes`);
    return 0;
  } finally {
    await target.close();
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
