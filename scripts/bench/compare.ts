import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analyzeSetup } from '@shared/analyze';
import { compareRevisions, type CompareSide } from '@shared/diff';
import type { Benchmark } from './benchmark';
import { demoPair, stressPair } from './support/compare-pairs';

// Compare of two revisions as the server does it (stored text, document and findings
// in; changes, counts, findings delta, outputs delta and text diff out), for the demo
// setup and the stress setup. For reference, the same revisions are stored as commits
// in a plain git repository in a temp folder and `git diff` is timed on the same
// pairs, and `git diff --no-index` on the stress pair as two plain files; index.ts
// prints the ratios.

function side(text: string): CompareSide {
  const analysis = analyzeSetup(text);
  if (!analysis.setup) throw new Error('bench revision is not schema-valid');
  // The server has the document and findings stored, not the parsed Setup.
  return { text, data: analysis.data, findings: analysis.findings };
}

const demo = demoPair.map(side) as [CompareSide, CompareSide];
const stress = stressPair.map(side) as [CompareSide, CompareSide];

// A repository of its own: no user or system configuration, hooks or signing.
function gitRepository(): { git: (...args: string[]) => string; dir: string } | null {
  const dir = mkdtempSync(join(tmpdir(), 'bindery-bench-git-'));
  const env = { ...process.env, GIT_CONFIG_GLOBAL: '/dev/null', GIT_CONFIG_NOSYSTEM: '1' };
  const git = (...args: string[]) =>
    execFileSync(
      'git',
      [
        '-c',
        'user.name=Bench',
        '-c',
        'user.email=bench@example.invalid',
        '-c',
        'commit.gpgsign=false',
        '-c',
        'core.hooksPath=/dev/null',
        ...args,
      ],
      { cwd: dir, env, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] },
    );
  try {
    git('init', '-q');
  } catch {
    rmSync(dir, { recursive: true, force: true });
    return null;
  }
  process.once('exit', () => rmSync(dir, { recursive: true, force: true }));
  return { git, dir };
}

function commit(
  repo: NonNullable<ReturnType<typeof gitRepository>>,
  file: string,
  text: string,
  message: string,
): string {
  writeFileSync(join(repo.dir, file), text);
  repo.git('add', file);
  repo.git('commit', '-q', '--allow-empty', '-m', message);
  return repo.git('rev-parse', 'HEAD').trim();
}

/** `git diff --no-index` of two files in the repository's folder; it exits 1 when they differ. */
function diffFiles(repo: NonNullable<ReturnType<typeof gitRepository>>, a: string, b: string): string {
  const result = spawnSync('git', ['diff', '--no-index', '--', a, b], { cwd: repo.dir, encoding: 'utf8' });
  if (result.status !== 1) throw new Error(`git diff --no-index answered ${result.status}: ${result.stderr}`);
  return result.stdout;
}

const repo = gitRepository();

export const benchmarks: Benchmark[] = [
  {
    name: 'compare, demo revisions (diff, deltas, text)',
    budgetMs: 10,
    run: () => compareRevisions(demo[0], demo[1]),
  },
  {
    name: 'compare, stress revisions (32 ch, 300 mixes)',
    budgetMs: 50,
    iterations: 100,
    run: () => compareRevisions(stress[0], stress[1]),
  },
];

if (repo) {
  const [demoA, demoB] = demoPair.map((text, index) => commit(repo, 'demo.yaml', text, `demo revision ${index + 1}`));
  const [stressA, stressB] = stressPair.map((text, index) =>
    commit(repo, 'stress.yaml', text, `stress revision ${index + 1}`),
  );
  writeFileSync(join(repo.dir, 'stress-before.yaml'), stressPair[0]);
  writeFileSync(join(repo.dir, 'stress-after.yaml'), stressPair[1]);
  let saves = 0;
  benchmarks.push(
    {
      name: 'git (reference): store a revision as a commit',
      iterations: 30,
      run: () => {
        saves += 1;
        return commit(repo, 'demo.yaml', demoPair[saves % 2], `save ${saves}`);
      },
    },
    {
      name: 'git (reference): git diff, demo revisions',
      iterations: 50,
      run: () => repo.git('diff', demoA, demoB, '--', 'demo.yaml'),
    },
    {
      // The two files as files, outside any repository: what `git diff` costs a pilot
      // comparing two exported setups, process start included.
      name: 'git (reference): git diff --no-index, stress files',
      iterations: 50,
      run: () => diffFiles(repo, 'stress-before.yaml', 'stress-after.yaml'),
    },
    {
      name: 'git (reference): git diff, stress revisions',
      iterations: 50,
      run: () => repo.git('diff', stressA, stressB, '--', 'stress.yaml'),
    },
  );
} else {
  console.log('git is not available: the git reference timings are skipped.');
}
