// npm test: every test, from a fresh clone. First the vitest projects (shared, api,
// web; the api project's global setup runs a throwaway PostgreSQL of its own), then
// the browser tests against the built app. Prints each runner's own summary and a
// closing total; exits non-zero when anything failed.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { bin } from './lib/paths';
import { runCommand } from './lib/run-command';

interface RunTotals {
  label: string;
  exitCode: number;
  passed: number;
  failed: number;
  skipped: number;
  /** false when the runner wrote no report (it did not get to run tests) */
  reported: boolean;
}

interface VitestJsonReport {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTodoTests: number;
}

const reportDir = mkdtempSync(path.join(os.tmpdir(), 'bindery-test-report-'));
// Nothing the tests start may reach the database or the secret npm start uses.
const env: NodeJS.ProcessEnv = { ...process.env };
delete env.DATABASE_URL;
delete env.JWT_SECRET;

async function runVitest(label: string, args: string[]): Promise<RunTotals> {
  const report = path.join(reportDir, `${label.replace(/[^a-z0-9]+/gi, '-')}.json`);
  console.log(`\n=== ${label} ===`);
  const exitCode = await runCommand(
    bin('vitest'),
    ['run', ...args, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`],
    { env },
  );
  if (!existsSync(report)) return { label, exitCode: exitCode || 1, passed: 0, failed: 0, skipped: 0, reported: false };
  const totals = JSON.parse(readFileSync(report, 'utf8')) as VitestJsonReport;
  return {
    label,
    exitCode,
    passed: totals.numPassedTests,
    failed: totals.numFailedTests,
    skipped: totals.numPendingTests + totals.numTodoTests,
    reported: true,
  };
}

async function main(): Promise<number> {
  const runs = [
    await runVitest('unit, api and component tests', []),
    await runVitest('browser tests', ['--config', 'tests/e2e/vitest.config.ts']),
  ];
  console.log('\n=== summary ===');
  for (const run of runs) {
    const state = run.reported
      ? `${run.passed} passed, ${run.failed} failed, ${run.skipped} skipped`
      : 'did not run (see the output above)';
    console.log(`${run.label}: ${state}${run.exitCode !== 0 ? ` (exit ${run.exitCode})` : ''}`);
  }
  const sum = (key: 'passed' | 'failed' | 'skipped') => runs.reduce((total, run) => total + run[key], 0);
  const failed = runs.some((run) => run.exitCode !== 0);
  console.log(`Total: ${sum('passed')} passed, ${sum('failed')} failed, ${sum('skipped')} skipped`);
  return failed ? 1 : 0;
}

main()
  .then((code) => {
    rmSync(reportDir, { recursive: true, force: true });
    process.exit(code);
  })
  .catch((error) => {
    console.error(error);
    process.exit(1);
  });
