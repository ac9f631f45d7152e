import { readFileSync, statSync } from 'node:fs';

// Shared by the command-line tools (docs/format.md, "Command line"): reading a setup file,
// and the exit-2 answer when a file or the arguments cannot be used.

/** Files beyond this are not read into memory at all; setups over 512 KB are refused anyway. */
const MAX_READ_BYTES = 64 * 1024 * 1024;

export type SetupFile = { ok: true; file: string; text: string } | { ok: false; file: string; message: string };

/** Reads a setup file as UTF-8 text, or says in words why it cannot be read. */
export function readSetupFile(file: string): SetupFile {
  try {
    const stat = statSync(file);
    if (!stat.isFile()) return { ok: false, file, message: `${file}: not a file` };
    if (stat.size > MAX_READ_BYTES)
      return { ok: false, file, message: `${file}: too large to be a setup (${stat.size} bytes)` };
    const bytes = readFileSync(file);
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      return { ok: false, file, message: `${file}: not UTF-8 text` };
    }
    return { ok: true, file, text: text.charCodeAt(0) === 0xfeff ? text.slice(1) : text };
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') return { ok: false, file, message: `${file}: no such file` };
    if (code === 'EACCES') return { ok: false, file, message: `${file}: permission denied` };
    return { ok: false, file, message: `${file}: cannot be read (${code ?? String(error)})` };
  }
}

/**
 * Reports a file that cannot be read or arguments that cannot be used, and gives exit
 * code 2. With --json the answer stays one JSON object on standard output.
 */
export function failUnreadable(json: boolean, message: string): 2 {
  if (json) process.stdout.write(`${JSON.stringify({ error: { message } })}\n`);
  else process.stderr.write(`${message}\n`);
  return 2;
}
