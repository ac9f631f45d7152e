import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// The repository explains itself from a clone alone: what its code cites is inside it,
// and its folder maps name the folders that exist.
const root = path.resolve(__dirname, '../..');
const tracked = execFileSync('git', ['ls-files', '-co', '--exclude-standard'], { cwd: root, encoding: 'utf8' })
  .split('\n')
  .filter((file) => file.length > 0);
const read = (file: string) => readFileSync(path.join(root, file), 'utf8');

/** Tracked folders one and two levels deep (`api/`, `api/routes/`), dot-folders aside. */
function foldersOfTheTree(): string[] {
  const folders = new Set<string>();
  for (const file of tracked) {
    const parts = file.split('/');
    if (parts[0].startsWith('.') || parts.length < 2) continue;
    folders.add(`${parts[0]}/`);
    if (parts.length > 2) folders.add(`${parts[0]}/${parts[1]}/`);
  }
  return [...folders].sort();
}

function section(markdown: string, heading: string): string {
  const start = markdown.indexOf(`\n## ${heading}\n`);
  expect(start, `a "## ${heading}" section`).toBeGreaterThan(-1);
  const end = markdown.indexOf('\n## ', start + 1);
  return markdown.slice(start, end === -1 ? undefined : end);
}

describe('the repository is self-contained', () => {
  it('cites no document outside the repository', () => {
    const outside = /\b(?:DESIGN|FORMAT|SOURCES|STACK)\.md\b|\.\.\/shared\/[A-Z]/;
    const offenders = tracked
      .filter((file) => /\.(?:ts|tsx|mjs|js|md|yaml|json|css|html)$/.test(file) && !file.endsWith('package-lock.json'))
      .filter((file) => file !== 'tests/shared/repository.test.ts')
      .filter((file) => outside.test(read(file)));
    expect(offenders).toEqual([]);
  });

  it('resolves every source label the code and tests cite in docs/sources.md', () => {
    const sources = read('docs/sources.md');
    const cited = new Set<string>();
    for (const file of tracked.filter((name) => /^(?:shared|api|web|tests|scripts)\/.*\.tsx?$/.test(name))) {
      for (const match of read(file).matchAll(/\/\/.*?\[([a-z][a-z0-9]*(?:-[a-z0-9.]+)+)\]/g)) cited.add(match[1]);
    }
    expect(cited.size).toBeGreaterThan(0);
    const missing = [...cited].filter((label) => !sources.includes(`[${label}]`));
    expect(missing).toEqual([]);
  });

  it("names every folder of the tree in the README's folder map, and no folder that is gone", () => {
    const map = section(read('README.md'), 'Folders');
    const named = [...map.matchAll(/`([a-z][a-z0-9-]*\/(?:[a-z][a-z0-9-]*\/)?)`/g)].map((match) => match[1]);
    expect([...new Set(named)].sort()).toEqual(foldersOfTheTree());
  });

  it('names every folder in the contributor guide', () => {
    const guide = read('DEVELOPERS.md');
    const missing = foldersOfTheTree().filter((folder) => {
      const name = folder.split('/').filter(Boolean).pop()!;
      return !new RegExp(`(?:^|[\\s\`/])${name}/`, 'm').test(guide);
    });
    expect(missing).toEqual([]);
  });
});
