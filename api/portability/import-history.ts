import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { SLUG_PATTERN } from '../../shared/format/schema';
import { MAX_TEXT_BYTES } from '../../shared/parse/limits';
import { TooLarge, Unprocessable } from '../errors';
import { catFile } from './cat-file';
import { parseCommitMessage } from './commit-message';
import { SETUP_FILE } from './export-history';
import { GitError, withGit, type Git } from './git-cli';

// Reads a git bundle (a Bindery export, or any repository a pilot kept by hand) into
// the revisions to create. The history is the first-parent line of the bundle's HEAD.
// A repository with `setup.yaml` at the top is one model; otherwise each folder with a
// `setup.yaml` is one. A commit is a revision of a model when it changes that model's
// file, or when Bindery's trailers say it is one (a save that changed nothing).

export const MAX_IMPORT_REVISIONS = 20_000;
export const MAX_IMPORT_MODELS = 200;

export interface ImportedRevision {
  commit: string;
  text: string;
  message: string;
  createdAt: Date;
  /** The hash the exporting Bindery recorded, when the commit carries it. */
  recordedHash: string | null;
}

export interface ImportedModel {
  folder: string | null;
  /** The model's name as the export recorded it, if it did. */
  name: string | null;
  revisions: ImportedRevision[];
  /** Tags by name, each on a revision (index into `revisions`). */
  tags: { name: string; index: number }[];
}

interface CommitInfo {
  oid: string;
  message: string;
  trailers: ReturnType<typeof parseCommitMessage>['trailers'];
  createdAt: Date;
}

const notABundle = (reason: string) =>
  new Unprocessable(
    `This file is not a git bundle Bindery can read (${reason}). Upload the .bundle file a history export gave you.`,
    { code: 'not-a-git-bundle' },
  );

function parseCommit(oid: string, raw: Buffer): CommitInfo {
  const text = raw.toString('utf8');
  const split = text.indexOf('\n\n');
  const headers = split >= 0 ? text.slice(0, split) : text;
  const author = /^author .* (\d+) [+-]\d{4}$/m.exec(headers);
  const parsed = parseCommitMessage(split >= 0 ? text.slice(split + 2) : '');
  return {
    oid,
    message: parsed.message,
    trailers: parsed.trailers,
    createdAt: new Date(Number(author?.[1] ?? 0) * 1000),
  };
}

async function historyOf(git: Git, repo: string): Promise<string[]> {
  let head: string;
  try {
    head = (await git.text(['rev-parse', '--verify', '--quiet', 'HEAD^{commit}'], { cwd: repo })).trim();
  } catch {
    const branches = (await git.text(['for-each-ref', '--format=%(objectname)', 'refs/heads'], { cwd: repo }))
      .trim()
      .split('\n')
      .filter(Boolean);
    if (branches.length !== 1)
      throw notABundle(
        branches.length === 0 ? 'it holds no branch' : 'it has several branches and no HEAD to choose one',
      );
    head = branches[0];
  }
  const count = Number((await git.text(['rev-list', '--first-parent', '--count', head], { cwd: repo })).trim());
  if (count > MAX_IMPORT_REVISIONS) {
    throw new Unprocessable(`The history has ${count} commits; an import takes at most ${MAX_IMPORT_REVISIONS}.`, {
      code: 'too-many-revisions',
      details: { commits: count, limit: MAX_IMPORT_REVISIONS },
    });
  }
  return (await git.text(['rev-list', '--first-parent', '--reverse', head], { cwd: repo }))
    .trim()
    .split('\n')
    .filter(Boolean);
}

/** null for a repository with setup.yaml at the top, else the folders holding one. */
async function modelFolders(git: Git, repo: string, commits: string[]): Promise<(string | null)[]> {
  const listed = await git.text(
    ['-c', 'core.quotePath=false', 'log', '--first-parent', '--format=', '--name-only', commits[commits.length - 1]],
    { cwd: repo },
  );
  const paths = new Set(listed.split('\n').filter(Boolean));
  if (paths.has(SETUP_FILE)) return [null];
  const folders = [...paths]
    .map((file) => /^([^/\u0000-\u001f"]+)\/setup\.yaml$/.exec(file)?.[1])
    .filter((folder): folder is string => folder !== undefined)
    .sort();
  if (folders.length > MAX_IMPORT_MODELS) {
    throw new Unprocessable(
      `The repository holds ${folders.length} models; an import takes at most ${MAX_IMPORT_MODELS}.`,
      { code: 'too-many-models', details: { models: folders.length, limit: MAX_IMPORT_MODELS } },
    );
  }
  return folders;
}

async function tagsByCommit(git: Git, repo: string): Promise<Map<string, string[]>> {
  const listed = await git.text(
    ['for-each-ref', '--format=%(refname:strip=2)%00%(objectname)%00%(*objectname)', 'refs/tags'],
    { cwd: repo },
  );
  const byCommit = new Map<string, string[]>();
  for (const line of listed.split('\n').filter(Boolean)) {
    const [name, object, peeled] = line.split('\u0000');
    const commit = peeled || object;
    byCommit.set(commit, [...(byCommit.get(commit) ?? []), name]);
  }
  return byCommit;
}

function decodeText(buffer: Buffer, commit: string, file: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(buffer);
  } catch {
    throw new Unprocessable(`${file} in commit ${commit.slice(0, 12)} is not UTF-8 text; nothing was imported.`, {
      code: 'unreadable-setup',
      details: { commit, file },
    });
  }
}

/** The models in the bundle; a bundle git cannot read (or takes too long over) is a 422. */
export async function readHistoryBundle(bundle: Buffer): Promise<ImportedModel[]> {
  try {
    return await readWithGit(bundle);
  } catch (error) {
    if (error instanceof GitError)
      throw notABundle(
        error.stderr.includes('prerequisite') ? 'it needs commits from another repository' : 'git could not read it',
      );
    throw error;
  }
}

function readWithGit(bundle: Buffer): Promise<ImportedModel[]> {
  return withGit(async (git) => {
    const file = path.join(git.dir, 'upload.bundle');
    const repo = path.join(git.dir, 'history.git');
    await writeFile(file, bundle);
    await git.run(['clone', '--quiet', '--bare', file, repo]);
    const commits = await historyOf(git, repo);
    if (commits.length === 0) throw notABundle('it holds no commits');
    const folders = await modelFolders(git, repo, commits);
    if (folders.length === 0) {
      throw new Unprocessable(`No ${SETUP_FILE} was found in this history, at the top or in a folder per model.`, {
        code: 'no-setup-in-history',
      });
    }
    const fileOf = (folder: string | null) => (folder === null ? SETUP_FILE : `${folder}/${SETUP_FILE}`);

    const commitInfo = (await catFile(git, repo, commits, true)).map((answer, index) => {
      if (!answer.found || answer.type !== 'commit' || !answer.content)
        throw notABundle(`commit ${commits[index].slice(0, 12)} is missing`);
      return parseCommit(commits[index], answer.content);
    });
    const blobs = await catFile(
      git,
      repo,
      commits.flatMap((commit) => folders.map((folder) => `${commit}:${fileOf(folder)}`)),
      false,
    );
    const tags = await tagsByCommit(git, repo);

    const wanted: { folder: number; commit: number; blob: string }[] = [];
    folders.forEach((folder, f) => {
      let previous: string | null = null;
      commitInfo.forEach((info, c) => {
        const answer = blobs[c * folders.length + f];
        if (!answer.found || answer.type !== 'blob') return;
        if (answer.size > MAX_TEXT_BYTES) {
          throw new TooLarge(
            `${fileOf(folder)} in commit ${info.oid.slice(0, 12)} is ${Math.ceil(answer.size / 1024)} KB; setups up to ${MAX_TEXT_BYTES / 1024} KB are accepted.`,
            {
              details: { commit: info.oid, bytes: answer.size, limit: MAX_TEXT_BYTES },
            },
          );
        }
        const markedHere = info.trailers !== null && (info.trailers.folder ?? null) === folder;
        if (answer.oid !== previous || markedHere) wanted.push({ folder: f, commit: c, blob: answer.oid });
        previous = answer.oid;
      });
    });
    if (wanted.length > MAX_IMPORT_REVISIONS) {
      throw new Unprocessable(
        `The history has ${wanted.length} revisions; an import takes at most ${MAX_IMPORT_REVISIONS}.`,
        { code: 'too-many-revisions', details: { revisions: wanted.length, limit: MAX_IMPORT_REVISIONS } },
      );
    }
    const uniqueBlobs = [...new Set(wanted.map((entry) => entry.blob))];
    const texts = new Map<string, Buffer>();
    (await catFile(git, repo, uniqueBlobs, true)).forEach((answer, index) => {
      if (answer.found && answer.content) texts.set(uniqueBlobs[index], answer.content);
    });

    return folders.map((folder, f): ImportedModel => {
      const mine = wanted.filter((entry) => entry.folder === f);
      const revisions = mine.map(({ commit, blob }) => {
        const info = commitInfo[commit];
        return {
          commit: info.oid,
          text: decodeText(texts.get(blob) ?? Buffer.alloc(0), info.oid, fileOf(folder)),
          message: info.message,
          createdAt: info.createdAt,
          recordedHash: info.trailers?.contentHash ?? null,
        };
      });
      const prefix = folder === null ? '' : `${folder}/`;
      const modelTags: ImportedModel['tags'] = [];
      revisions.forEach((revision, index) => {
        for (const ref of tags.get(revision.commit) ?? []) {
          if (!ref.startsWith(prefix)) continue;
          const name = ref.slice(prefix.length);
          if (SLUG_PATTERN.test(name)) modelTags.push({ name, index });
        }
      });
      const last = [...mine]
        .reverse()
        .map(({ commit }) => commitInfo[commit].trailers?.modelName)
        .find((name) => name !== undefined);
      return { folder, name: last ?? null, revisions, tags: modelTags };
    });
  });
}
