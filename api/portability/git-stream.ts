import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import { GitError, GIT_TIMEOUT_MS } from './git-cli';

// A git command whose output is read as it arrives, never gathered whole: an import
// reads a stranger's history, and what git prints for it (messages, file texts) is as
// large as the stranger made it. The reader takes lines and exact byte counts; a
// caller that sees a limit passed stops reading and `kill()`s git, and only what it
// kept stays in memory.

export class GitStream {
  private readonly child: ChildProcessWithoutNullStreams;
  private readonly chunks: AsyncIterator<Buffer>;
  private buffer: Buffer = Buffer.alloc(0);
  /** True once git's output has been read to its end. */
  ended = false;
  private stderr = '';
  private readonly exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;

  constructor(
    private readonly args: string[],
    options: { cwd: string; env: NodeJS.ProcessEnv; input?: string },
  ) {
    this.child = spawn('git', args, {
      cwd: options.cwd,
      env: options.env,
      stdio: ['pipe', 'pipe', 'pipe'],
      timeout: GIT_TIMEOUT_MS,
      killSignal: 'SIGKILL',
    });
    this.exited = new Promise((resolve, reject) => {
      this.child.once('error', reject);
      this.child.once('close', (code, signal) => resolve({ code, signal }));
    });
    // An unhandled rejection if nobody awaits `done()` (the reader stopped early).
    this.exited.catch(() => {});
    this.child.stderr.on('data', (chunk: Buffer) => {
      if (this.stderr.length < 8192) this.stderr += chunk.toString('utf8');
    });
    this.child.stdin.on('error', () => {});
    this.child.stdin.end(options.input);
    this.chunks = this.child.stdout[Symbol.asyncIterator]();
  }

  private async fill(): Promise<boolean> {
    if (this.ended) return false;
    const next = await this.chunks.next();
    if (next.done) {
      this.ended = true;
      return false;
    }
    this.buffer = this.buffer.length === 0 ? next.value : Buffer.concat([this.buffer, next.value]);
    return true;
  }

  /** The next line without its newline, or null at the end; a line longer than `max` bytes is an error. */
  async line(max: number): Promise<string | null> {
    for (;;) {
      const end = this.buffer.indexOf(0x0a);
      if (end >= 0) {
        const text = this.buffer.subarray(0, end).toString('utf8');
        this.buffer = this.buffer.subarray(end + 1);
        return text;
      }
      if (this.buffer.length > max) throw new LineTooLong(max);
      if (!(await this.fill())) {
        if (this.buffer.length === 0) return null;
        const text = this.buffer.toString('utf8');
        this.buffer = Buffer.alloc(0);
        return text;
      }
    }
  }

  /** Exactly `size` bytes (the caller has checked `size` against its limit). */
  async bytes(size: number): Promise<Buffer> {
    while (this.buffer.length < size) {
      if (!(await this.fill())) throw new Error(`git ${this.args[0]} ended in the middle of an object`);
    }
    const out = Buffer.from(this.buffer.subarray(0, size));
    this.buffer = this.buffer.subarray(size);
    return out;
  }

  /** Stops git; what it would still have printed is never read. */
  kill(): void {
    this.child.stdout.destroy();
    this.child.kill('SIGKILL');
  }

  /** Waits for git to finish; a failed run is a GitError with its last words. */
  async done(): Promise<void> {
    const { code, signal } = await this.exited;
    if (code !== 0) {
      throw new GitError(
        this.args,
        code ?? 1,
        signal ? `${this.stderr}\nstopped by ${signal} after ${GIT_TIMEOUT_MS / 1000} s` : this.stderr,
      );
    }
  }
}

export class LineTooLong extends Error {
  override name = 'LineTooLong';
  constructor(readonly limit: number) {
    super(`git printed a line longer than ${limit} bytes`);
  }
}

/** Runs `read` over git's output; git is killed whenever `read` stops early or throws. */
export async function streamGit<T>(
  args: string[],
  options: { cwd: string; env: NodeJS.ProcessEnv; input?: string },
  read: (stream: GitStream) => Promise<T>,
): Promise<T> {
  const stream = new GitStream(args, options);
  let result: T;
  try {
    result = await read(stream);
  } catch (error) {
    stream.kill();
    throw error;
  }
  // A reader that stopped early wanted no more; one that read to the end wants git's verdict
  // (a failure or the time limit can cut the output short).
  if (stream.ended) await stream.done();
  else stream.kill();
  return result;
}
