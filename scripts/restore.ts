// npm run restore -- FILE --yes: replaces everything in the project's database
// (DATABASE_URL, or npm start's own cluster) with a backup made by npm run backup.
// pg_restore --clean in one transaction: on any error nothing changes. Without --yes
// it only says what it would do. Stop npm start first; a restore under a running app
// is refused.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { countRecords, formatCounts, openBackupTarget, otherSessions, runClient } from './lib/backup-database';

async function main(): Promise<number> {
  const { values, positionals } = parseArgs({
    options: { yes: { type: 'boolean', default: false } },
    allowPositionals: true,
  });
  if (positionals.length !== 1) {
    console.error('Usage: npm run restore -- FILE --yes   (FILE is a .dump made by npm run backup)');
    return 2;
  }
  const file = path.resolve(positionals[0]);
  if (!existsSync(file)) {
    console.error(`There is no file ${file}.`);
    return 2;
  }
  const target = await openBackupTarget((line) => console.log(line));
  try {
    const listing = await runClient(target.binDir, 'pg_restore', ['--list', file]);
    if (listing.code !== 0) {
      console.error(`${file} is not a backup pg_restore can read:\n${listing.output.trim()}`);
      return 2;
    }
    const before = await countRecords(target.url).catch(() => null);
    if (!values.yes) {
      console.log(
        `This would replace everything in ${target.label}${before ? ` (now ${formatCounts(before)})` : ''} with ${file}.`,
      );
      console.log('Nothing was changed. Run it again with --yes to restore.');
      return 1;
    }
    const sessions = await otherSessions(target.url);
    if (sessions > 0) {
      console.error(
        `${sessions} other connection(s) use ${target.label}: stop npm start (or whatever uses it) first, then restore.`,
      );
      return 1;
    }
    const result = await runClient(target.binDir, 'pg_restore', [
      '--clean',
      '--if-exists',
      '--no-owner',
      '--no-privileges',
      '--single-transaction',
      '--exit-on-error',
      '--no-password',
      `--dbname=${target.url}`,
      file,
    ]);
    if (result.code !== 0) {
      console.error(
        `pg_restore failed (exit ${result.code}); the database was left as it was:\n${result.output.trim()}`,
      );
      return 1;
    }
    console.log(
      `Restored ${file} into ${target.label}: ${formatCounts(await countRecords(target.url))}${before ? ` (was ${formatCounts(before)})` : ''}.`,
    );
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
