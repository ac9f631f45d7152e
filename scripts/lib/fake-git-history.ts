import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

// Git histories built in one `git fast-import` run (thousands of commits in a moment),
// for the import's limits: each commit sets files to a text or to a submodule link.

export interface FakeCommit {
  message: string;
  /** Seconds since 1970 for author and committer. */
  when: number;
  files: Record<string, string | { submodule: string }>;
}

const gitEnv = {
  PATH: process.env.PATH,
  HOME: os.tmpdir(),
  GIT_CONFIG_NOSYSTEM: '1',
  GIT_CONFIG_GLOBAL: '/dev/null',
  LANG: 'C',
};

function data(text: string): Buffer[] {
  const bytes = Buffer.from(text, 'utf8');
  return [Buffer.from(`data ${bytes.length}\n`), bytes, Buffer.from('\n')];
}

function fastImportStream(commits: Iterable<FakeCommit>): Buffer {
  const parts: Buffer[] = [];
  let mark = 0;
  let previous: number | null = null;
  for (const commit of commits) {
    const files: string[] = [];
    for (const [file, content] of Object.entries(commit.files)) {
      if (typeof content === 'string') {
        parts.push(Buffer.from(`blob\nmark :${++mark}\n`), ...data(content));
        files.push(`M 100644 :${mark} ${file}\n`);
      } else {
        files.push(`M 160000 ${content.submodule} ${file}\n`);
      }
    }
    const who = `Hand Kept <hand@test.example> ${commit.when} +0000`;
    parts.push(Buffer.from(`commit refs/heads/main\nmark :${++mark}\nauthor ${who}\ncommitter ${who}\n`));
    parts.push(...data(commit.message));
    if (previous !== null) parts.push(Buffer.from(`from :${previous}\n`));
    parts.push(Buffer.from(`${files.join('')}\n`));
    previous = mark;
  }
  parts.push(Buffer.from('done\n'));
  return Buffer.concat(parts);
}

/** The commits as a git bundle of branch main. */
export function bundleOf(commits: Iterable<FakeCommit>): Buffer {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'bindery-fake-history-'));
  try {
    const repo = path.join(dir, 'repo.git');
    execFileSync('git', ['init', '--quiet', '--bare', '--initial-branch', 'main', repo], { env: gitEnv });
    execFileSync('git', ['fast-import', '--quiet', '--done'], {
      cwd: repo,
      env: gitEnv,
      input: fastImportStream(commits),
      maxBuffer: 64 * 1024 * 1024,
    });
    const file = path.join(dir, 'history.bundle');
    execFileSync('git', ['bundle', 'create', '--quiet', file, '--all'], { cwd: repo, env: gitEnv });
    return readFileSync(file);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** `count` commits a minute apart from `start`, each giving setup.yaml the text `text(i)`. */
export function* setupCommits(
  count: number,
  text: (i: number) => string,
  start = 1_700_000_000,
): Generator<FakeCommit> {
  for (let i = 0; i < count; i++)
    yield { message: `Save ${i + 1}`, when: start + i * 60, files: { 'setup.yaml': text(i) } };
}
