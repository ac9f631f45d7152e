import { spawn } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { streamGit, type GitStream } from './git-stream';

// The git command line in a temporary folder of its own. No system or user
// configuration is read (GIT_CONFIG_NOSYSTEM, GIT_CONFIG_GLOBAL, HOME), so what the
// machine's git is set up to do (hooks paths, signing, default branch, aliases)
// cannot change an export, and nothing prompts.

export class GitError extends Error {
  override name = 'GitError';
  constructor(
    readonly args: string[],
    readonly code: number,
    readonly stderr: string,
  ) {
    super(`git ${args[0]} failed (exit ${code}): ${stderr.trim().split('\n').slice(-3).join(' ')}`);
  }
}

export interface GitResult {
  stdout: Buffer;
  stderr: string;
}

export interface Git {
  dir: string;
  run(args: string[], options?: { input?: string | Buffer; cwd?: string }): Promise<GitResult>;
  text(args: string[], options?: { input?: string | Buffer; cwd?: string }): Promise<string>;
  /** Reads git's output as it arrives (see git-stream.ts). */
  stream<T>(
    args: string[],
    options: { cwd?: string; input?: string },
    read: (stream: GitStream) => Promise<T>,
  ): Promise<T>;
}

export function gitEnv(home: string): NodeJS.ProcessEnv {
  return {
    PATH: process.env.PATH ?? '/usr/bin:/bin',
    HOME: home,
    LANG: 'C',
    LC_ALL: 'C',
    GIT_CONFIG_NOSYSTEM: '1',
    GIT_CONFIG_GLOBAL: '/dev/null',
    GIT_TERMINAL_PROMPT: '0',
    // Nothing but local files: a crafted bundle cannot make git reach out anywhere.
    GIT_ALLOW_PROTOCOL: 'file',
    GIT_AUTHOR_NAME: 'Bindery',
    GIT_AUTHOR_EMAIL: 'export@bindery.invalid',
    GIT_COMMITTER_NAME: 'Bindery',
    GIT_COMMITTER_EMAIL: 'export@bindery.invalid',
  };
}

// A crafted upload (a pack that inflates to gigabytes) must not keep git busy for long.
export const GIT_TIMEOUT_MS = 60_000;

function runGit(args: string[], cwd: string, env: NodeJS.ProcessEnv, input?: string | Buffer): Promise<GitResult> {
  return new Promise((resolve, reject) => {
    const child = spawn('git', args, {
      cwd,
      env,
      stdio: ['pipe', 'pipe', 'pipe'],
      timeout: GIT_TIMEOUT_MS,
      killSignal: 'SIGKILL',
    });
    const out: Buffer[] = [];
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString('utf8')));
    child.on('error', (error: NodeJS.ErrnoException) =>
      reject(
        error.code === 'ENOENT'
          ? new Error('The git command line is needed for history export and import, and it is not installed.')
          : error,
      ),
    );
    child.on('close', (code, signal) =>
      code === 0
        ? resolve({ stdout: Buffer.concat(out), stderr })
        : reject(
            new GitError(
              args,
              code ?? 1,
              signal ? `${stderr}\nstopped by ${signal} after ${GIT_TIMEOUT_MS / 1000} s` : stderr,
            ),
          ),
    );
    // A git that exits early (a bad bundle) closes its input; that is reported by the exit code.
    child.stdin.on('error', () => {});
    child.stdin.end(input);
  });
}

/** Runs `work` with git in a fresh temporary folder, removed afterwards whatever happens. */
export async function withGit<T>(work: (git: Git) => Promise<T>): Promise<T> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'bindery-git-'));
  const env = gitEnv(dir);
  const git: Git = {
    dir,
    run: (args, options = {}) => runGit(args, options.cwd ?? dir, env, options.input),
    text: async (args, options = {}) =>
      (await runGit(args, options.cwd ?? dir, env, options.input)).stdout.toString('utf8'),
    stream: (args, options, read) => streamGit(args, { cwd: options.cwd ?? dir, env, input: options.input }, read),
  };
  try {
    return await work(git);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
