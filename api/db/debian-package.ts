import { spawn } from 'node:child_process';

export const isRoot = (): boolean => process.getuid?.() === 0;

export class MissingPackageError extends Error {
  override name = 'MissingPackageError';
}

function aptGet(args: string[]): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn('apt-get', args, {
      cwd: '/',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
      stdio: 'inherit',
    });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

/**
 * Installs one of Debian's packages when `isPresent` says it is missing. Only root can
 * install; anyone else gets one line saying what to install and why, so a fresh machine
 * is set up by the project's own commands rather than by hand.
 */
export async function ensureDebianPackage(options: {
  name: string;
  purpose: string;
  isPresent: () => boolean;
  log?: (line: string) => void;
}): Promise<void> {
  const log = options.log ?? console.log;
  if (options.isPresent()) return;
  if (!isRoot()) {
    throw new MissingPackageError(
      `${options.purpose} needs Debian's "${options.name}" package: run "sudo apt-get install -y ${options.name}", then this again.`,
    );
  }
  log(`${options.purpose} needs Debian's "${options.name}" package; installing it with apt-get...`);
  for (const args of [
    ['update', '-qq'],
    ['install', '-y', '-qq', options.name],
  ]) {
    const code = await aptGet(args);
    if (code !== 0) throw new MissingPackageError(`apt-get ${args.join(' ')} failed (exit ${code}).`);
  }
  if (!options.isPresent())
    throw new MissingPackageError(`apt-get installed "${options.name}" but it is still missing.`);
}
