// npm test: every check and test, from a fresh clone. First what the machine lacks
// (PostgreSQL's server programs, Chromium), then the static checks (types, lint,
// format), then the vitest projects (shared, api, web; the api project's global setup
// runs a throwaway PostgreSQL of its own), then the browser tests against the built
// app. Prints each runner's own summary and a closing total; exits non-zero when
// anything failed.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { bin } from './lib/paths';
import { runCommand } from './lib/run-command';
import { ensureTestPrerequisites } from './lib/test-prerequisites';

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

interface StaticCheck {
  label: string;
  exitCode: number;
}

// The package.json scripts, so a contributor runs exactly what npm test runs.
const STATIC_CHECKS = [
  { label: 'types (tsc)', script: 'typecheck' },
  { label: 'lint (eslint)', script: 'lint' },
  { label: 'format (prettier)', script: 'format:check' },
];

async function runStaticChecks(): Promise<StaticCheck[]> {
  const results: StaticCheck[] = [];
  for (const check of STATIC_CHECKS) {
    console.log(`\n=== ${check.label} ===`);
    results.push({ label: check.label, exitCode: await runCommand('npm', ['run', '--silent', check.script], { env }) });
  }
  return results;
}

async function main(): Promise<number> {
  await ensureTestPrerequisites();
  const checks = await runStaticChecks();
  const runs = [
    await runVitest('unit, api and component tests', []),
    await runVitest('browser tests', ['--config', 'tests/e2e/vitest.config.ts']),
  ];
  console.log('\n=== summary ===');
  for (const check of checks)
    console.log(`${check.label}: ${check.exitCode === 0 ? 'clean' : `failed (exit ${check.exitCode})`}`);
  for (const run of runs) {
    const state = run.reported
      ? `${run.passed} passed, ${run.failed} failed, ${run.skipped} skipped`
      : 'did not run (see the output above)';
    console.log(`${run.label}: ${state}${run.exitCode !== 0 ? ` (exit ${run.exitCode})` : ''}`);
  }
  const sum = (key: 'passed' | 'failed' | 'skipped') => runs.reduce((total, run) => total + run[key], 0);
  const failed = runs.some((run) => run.exitCode !== 0) || checks.some((check) => check.exitCode !== 0);
  // A failed static check counts as a failure in the closing line, so it never reads as all-clear.
  const failedChecks = checks.filter((check) => check.exitCode !== 0).length;
  console.log(`Total: ${sum('passed')} passed, ${sum('failed') + failedChecks} failed, ${sum('skipped')} skipped`);
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
