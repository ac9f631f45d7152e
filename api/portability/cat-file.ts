import type { Git } from './git-cli';

// `git cat-file --batch` / `--batch-check`: many objects through one process. Each
// answer is "<oid> <type> <size>" (then, for --batch, the content and a newline) or
// "<name> missing".

export type CatFileAnswer =
  { found: true; oid: string; type: string; size: number; content: Buffer | null } | { found: false; name: string };

export async function catFile(git: Git, repo: string, names: string[], withContent: boolean): Promise<CatFileAnswer[]> {
  if (names.length === 0) return [];
  const { stdout } = await git.run(['cat-file', withContent ? '--batch' : '--batch-check'], {
    cwd: repo,
    input: `${names.join('\n')}\n`,
  });
  const answers: CatFileAnswer[] = [];
  let at = 0;
  for (let index = 0; index < names.length; index++) {
    const end = stdout.indexOf(0x0a, at);
    if (end < 0) throw new Error('git cat-file answered fewer objects than asked for');
    const header = stdout.subarray(at, end).toString('utf8');
    at = end + 1;
    const match = /^([0-9a-f]{40,64}) (\S+) (\d+)$/.exec(header);
    if (!match) {
      answers.push({ found: false, name: names[index] });
      continue;
    }
    const size = Number(match[3]);
    let content: Buffer | null = null;
    if (withContent) {
      content = stdout.subarray(at, at + size);
      at += size + 1;
    }
    answers.push({ found: true, oid: match[1], type: match[2], size, content });
  }
  return answers;
}
