import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { SLUG_PATTERN } from '@shared/format/schema';
import { TooLarge, Unprocessable } from '../errors';
import { message as messageField } from '../model-fields';
import { parseCommitMessage } from './commit-message';
import { SETUP_FILE } from './export-history';
import { GitError, withGit, type Git } from './git-cli';
import { LineTooLong } from './git-stream';
import {
  EARLIEST_AUTHOR_DATE,
  FUTURE_AUTHOR_SLACK_MS,
  MAX_COMMIT_BYTES,
  MAX_IMPORT_COMMITS,
  MAX_IMPORT_MODELS,
  MAX_IMPORT_REVISIONS,
  MAX_IMPORT_TAGS,
  MAX_IMPORT_TEXT_BYTES,
  MAX_MESSAGE_CHARS,
  MAX_SETUP_BYTES,
} from './import-limits';

// Reads a git bundle (a Bindery export, or any repository a pilot kept by hand) into
// the revisions to create. The history is the first-parent line of the bundle's HEAD.
// A repository with `setup.yaml` at the top is one model; otherwise each folder with a
// `setup.yaml` is one. A commit is a revision of a model when it changes that model's
// file, or when Bindery's trailers say it is one (a save that changed nothing).
// git's output is read as it arrives and every limit (import-limits.ts) is checked
// on the way, so a hostile bundle is refused at its first excess, with git stopped.

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

export interface ImportProgress {
  commits_total: number;
  commits_read: number;
  revisions_total: number;
  revisions_checked: number;
  revisions_stored: number;
}

/** Called as the import gets on, so its job can show how far it is. */
export type ReportProgress = (update: Partial<ImportProgress>) => Promise<void>;

const REPORT_EVERY = 500;

interface CommitInfo {
  oid: string;
  message: string;
  trailers: ReturnType<typeof parseCommitMessage>['trailers'];
  createdAt: Date;
}

/** A model's setup file in one commit: its new blob, or null where the commit deletes it. */
interface SetupChange {
  folder: string | null;
  blob: string | null;
}

interface FirstParentLine {
  /** Oldest first. */
  commits: string[];
  changes: Map<string, SetupChange[]>;
  /** Where a setup file was ever seen: null for the top of the repository. */
  places: Set<string | null>;
}

const notABundle = (reason: string) =>
  new Unprocessable(
    `This file is not a git bundle Bindery can read (${reason}). Upload the .bundle file a history export gave you.`,
    { code: 'not-a-git-bundle' },
  );

const short = (oid: string) => oid.slice(0, 12);

// Paths, ref names and object headers are short; a longer line is not a history to read.
const MAX_LINE_BYTES = 64 * 1024;
const SETUP_PATH = /^(?:([^/\u0000-\u001f"]+)\/)?setup\.yaml$/;
const RAW_CHANGE = /^:\d{6} (\d{6}) [0-9a-f]+ ([0-9a-f]+) ([A-Z])\d*\t(.*)$/;
const FILE_MODES = new Set(['100644', '100755']);

function notAFile(file: string, commit: string, mode: string): Unprocessable {
  const what =
    mode === '160000'
      ? 'a submodule (a link to another repository)'
      : mode === '120000'
        ? 'a symbolic link'
        : 'not a plain file';
  return new Unprocessable(
    `${file} in commit ${short(commit)} is ${what}; Bindery imports a setup only as a file of its own. Nothing was imported.`,
    { code: 'setup-not-a-file', details: { commit, file, mode } },
  );
}

const tooMany = (what: string, code: string, limit: number) =>
  new Unprocessable(
    `The history has more than ${limit} ${what}; an import takes at most ${limit}. Nothing was imported.`,
    {
      code,
      details: { limit },
    },
  );

async function historyHead(git: Git, repo: string): Promise<string> {
  try {
    return (await git.text(['rev-parse', '--verify', '--quiet', 'HEAD^{commit}'], { cwd: repo })).trim();
  } catch {
    // Without HEAD, the one branch there is; two lines are enough to know there are several.
    const branches = await git.stream(
      ['for-each-ref', '--format=%(objectname)', 'refs/heads'],
      { cwd: repo },
      async (out) => {
        const found: string[] = [];
        for (
          let line = await out.line(MAX_LINE_BYTES);
          line !== null && found.length < 2;
          line = await out.line(MAX_LINE_BYTES)
        )
          if (line) found.push(line);
        return found;
      },
    );
    if (branches.length !== 1)
      throw notABundle(
        branches.length === 0 ? 'it holds no branch' : 'it has several branches and no HEAD to choose one',
      );
    return branches[0];
  }
}

/**
 * The first-parent line with what each commit did to a setup file, in one `git log`
 * read line by line (newest first, so a history past the commit limit is refused at
 * the limit, not after git has listed all of it).
 */
function firstParentLine(git: Git, repo: string, head: string): Promise<FirstParentLine> {
  const args = ['-c', 'core.quotePath=false', 'log', '--first-parent', '--root', '--raw', '--no-abbrev'];
  args.push('--no-renames', '--diff-merges=first-parent', '--format=%x00%H', head);
  return git.stream(args, { cwd: repo }, async (out) => {
    const commits: string[] = [];
    const changes = new Map<string, SetupChange[]>();
    const places = new Set<string | null>();
    let changeCount = 0;
    for (let line = await out.line(MAX_LINE_BYTES); line !== null; line = await out.line(MAX_LINE_BYTES)) {
      if (line.startsWith('\u0000')) {
        commits.push(line.slice(1));
        if (commits.length > MAX_IMPORT_COMMITS) throw tooMany('commits', 'too-many-commits', MAX_IMPORT_COMMITS);
        continue;
      }
      const change = RAW_CHANGE.exec(line);
      const place = change && SETUP_PATH.exec(change[4]);
      if (!change || !place || commits.length === 0) continue;
      const [, mode, blob, status, file] = change;
      const commit = commits[commits.length - 1];
      if (status !== 'D' && !FILE_MODES.has(mode)) throw notAFile(file, commit, mode);
      const folder = place[1] ?? null;
      places.add(folder);
      if (places.size > MAX_IMPORT_MODELS + 1) throw tooMany('models', 'too-many-models', MAX_IMPORT_MODELS);
      // Every change can become a revision: bounding them bounds what is kept here.
      if (++changeCount > MAX_IMPORT_REVISIONS) throw tooMany('revisions', 'too-many-revisions', MAX_IMPORT_REVISIONS);
      changes.set(commit, [...(changes.get(commit) ?? []), { folder, blob: status === 'D' ? null : blob }]);
    }
    return { commits: commits.reverse(), changes, places };
  });
}

/** null for a repository with setup.yaml at the top, else the folders holding one. */
function modelFolders(places: Set<string | null>): (string | null)[] {
  if (places.has(null)) return [null];
  const folders = [...places].filter((folder): folder is string => folder !== null).sort();
  if (folders.length > MAX_IMPORT_MODELS) throw tooMany('models', 'too-many-models', MAX_IMPORT_MODELS);
  return folders;
}

/** `characters` when the message was read; `bytes` when the commit was too large to read. */
function messageTooLong(commit: string, size: { characters: number } | { bytes: number }): Unprocessable {
  const measured =
    'characters' in size
      ? `is ${size.characters} characters`
      : `cannot be read: the commit is ${Math.ceil(size.bytes / 1024)} KB`;
  return new Unprocessable(
    `The message of commit ${short(commit)} ${measured}; a revision message takes at most ${MAX_MESSAGE_CHARS} characters, as for a save. Nothing was imported.`,
    { code: 'message-too-long', details: { commit, ...size, limit: MAX_MESSAGE_CHARS } },
  );
}

function parseCommit(oid: string, raw: Buffer, latest: Date): CommitInfo {
  const text = raw.toString('utf8');
  const split = text.indexOf('\n\n');
  const headers = split >= 0 ? text.slice(0, split) : text;
  const parsed = parseCommitMessage(split >= 0 ? text.slice(split + 2) : '');
  const checked = messageField.safeParse(parsed.message);
  if (!checked.success) {
    if (parsed.message.trim().length > MAX_MESSAGE_CHARS)
      throw messageTooLong(oid, { characters: parsed.message.trim().length });
    throw new Unprocessable(
      `The message of commit ${short(oid)} cannot be a revision message: ${checked.error.issues[0].message} Nothing was imported.`,
      { code: 'unreadable-message', details: { commit: oid } },
    );
  }
  const author = /^author .* (-?\d+) [+-]\d{4}$/m.exec(headers);
  const createdAt = new Date(Number(author?.[1] ?? Number.NaN) * 1000);
  if (!(createdAt >= EARLIEST_AUTHOR_DATE && createdAt <= latest)) {
    const when = Number.isNaN(createdAt.getTime()) ? 'no readable date' : `the date ${createdAt.toISOString()}`;
    throw new Unprocessable(
      `Commit ${short(oid)} has ${when}; an imported revision is dated between ${EARLIEST_AUTHOR_DATE.toISOString().slice(0, 10)} and a day from now. Nothing was imported.`,
      {
        code: 'author-date-out-of-range',
        details: {
          commit: oid,
          date: Number.isNaN(createdAt.getTime()) ? null : createdAt.toISOString(),
          earliest: EARLIEST_AUTHOR_DATE.toISOString(),
          latest: latest.toISOString(),
        },
      },
    );
  }
  return { oid, message: parsed.message, trailers: parsed.trailers, createdAt };
}

const BATCH_HEADER = /^([0-9a-f]{40,64}) (\S+) (\d+)$/;

/** Each commit through one `git cat-file --batch`, its size checked before it is read. */
function readCommits(git: Git, repo: string, commits: string[], report: ReportProgress): Promise<CommitInfo[]> {
  const latest = new Date(Date.now() + FUTURE_AUTHOR_SLACK_MS);
  return git.stream(['cat-file', '--batch'], { cwd: repo, input: `${commits.join('\n')}\n` }, async (out) => {
    const infos: CommitInfo[] = [];
    for (const oid of commits) {
      const header = BATCH_HEADER.exec((await out.line(MAX_LINE_BYTES)) ?? '');
      if (!header || header[2] !== 'commit') throw notABundle(`commit ${short(oid)} is missing`);
      const size = Number(header[3]);
      // Larger than any commit with a message a save could have: refused unread.
      if (size > MAX_COMMIT_BYTES) throw messageTooLong(oid, { bytes: size });
      infos.push(parseCommit(oid, await out.bytes(size), latest));
      await out.bytes(1);
      if (infos.length % REPORT_EVERY === 0) await report({ commits_read: infos.length });
    }
    await report({ commits_read: infos.length });
    return infos;
  });
}

/** The setup texts by blob id, each and all together within their limits. */
function readBlobs(
  git: Git,
  repo: string,
  blobs: string[],
  fileOf: (blob: string) => string,
): Promise<Map<string, Buffer>> {
  return git.stream(['cat-file', '--batch'], { cwd: repo, input: `${blobs.join('\n')}\n` }, async (out) => {
    const texts = new Map<string, Buffer>();
    let total = 0;
    for (const blob of blobs) {
      const header = BATCH_HEADER.exec((await out.line(MAX_LINE_BYTES)) ?? '');
      if (!header || header[2] !== 'blob') throw notABundle(`the file ${fileOf(blob)} (${short(blob)}) is missing`);
      const size = Number(header[3]);
      if (size > MAX_SETUP_BYTES) {
        throw new TooLarge(
          `${fileOf(blob)} (${short(blob)}) is ${Math.ceil(size / 1024)} KB; setups up to ${MAX_SETUP_BYTES / 1024} KB are accepted. Nothing was imported.`,
          { code: 'setup-too-large', details: { blob, bytes: size, limit: MAX_SETUP_BYTES } },
        );
      }
      total += size;
      if (total > MAX_IMPORT_TEXT_BYTES) {
        throw new TooLarge(
          `The setups in this history add up to more than ${MAX_IMPORT_TEXT_BYTES / 1024 / 1024} MB; an import takes at most that. Nothing was imported.`,
          { code: 'history-too-large', details: { limit: MAX_IMPORT_TEXT_BYTES } },
        );
      }
      texts.set(blob, await out.bytes(size));
      await out.bytes(1);
    }
    return texts;
  });
}

/** Tags by the commit they name; a tag that names a tag is followed to its commit. */
function tagsByCommit(git: Git, repo: string): Promise<Map<string, string[]>> {
  const args = ['for-each-ref', '--format=%(refname:strip=2)%00%(objectname)%00%(*objectname)', 'refs/tags'];
  return git.stream(args, { cwd: repo }, async (out) => {
    const byCommit = new Map<string, string[]>();
    let count = 0;
    for (let line = await out.line(MAX_LINE_BYTES); line !== null; line = await out.line(MAX_LINE_BYTES)) {
      if (!line) continue;
      if (++count > MAX_IMPORT_TAGS) throw tooMany('tags', 'too-many-tags', MAX_IMPORT_TAGS);
      const [name, object, peeled] = line.split('\u0000');
      const commit = peeled || object;
      byCommit.set(commit, [...(byCommit.get(commit) ?? []), name]);
    }
    return byCommit;
  });
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
export async function readHistoryBundle(bundle: Buffer, report: ReportProgress): Promise<ImportedModel[]> {
  try {
    return await readWithGit(bundle, report);
  } catch (error) {
    if (error instanceof LineTooLong) throw notABundle('git printed a line of it longer than any history has');
    if (error instanceof GitError)
      throw notABundle(
        error.stderr.includes('prerequisite') ? 'it needs commits from another repository' : 'git could not read it',
      );
    throw error;
  }
}

function readWithGit(bundle: Buffer, report: ReportProgress): Promise<ImportedModel[]> {
  return withGit(async (git) => {
    const file = path.join(git.dir, 'upload.bundle');
    const repo = path.join(git.dir, 'history.git');
    await writeFile(file, bundle);
    await git.run(['clone', '--quiet', '--bare', file, repo]);
    const line = await firstParentLine(git, repo, await historyHead(git, repo));
    const { commits } = line;
    if (commits.length === 0) throw notABundle('it holds no commits');
    await report({ commits_total: commits.length });
    const folders = modelFolders(line.places);
    if (folders.length === 0) {
      throw new Unprocessable(`No ${SETUP_FILE} was found in this history, at the top or in a folder per model.`, {
        code: 'no-setup-in-history',
      });
    }
    const fileOf = (folder: string | null) => (folder === null ? SETUP_FILE : `${folder}/${SETUP_FILE}`);
    const commitInfo = await readCommits(git, repo, commits, report);

    const wanted: { folder: number; commit: number; blob: string }[] = [];
    const blobFile = new Map<string, string>();
    folders.forEach((folder, f) => {
      let current: string | null = null;
      let previous: string | null = null;
      commitInfo.forEach((info, c) => {
        for (const change of line.changes.get(info.oid) ?? []) if (change.folder === folder) current = change.blob;
        // Before the file exists, or while it is deleted, the commit is no revision of it.
        if (current === null) return;
        const markedHere = info.trailers !== null && (info.trailers.folder ?? null) === folder;
        if (current !== previous || markedHere) wanted.push({ folder: f, commit: c, blob: current });
        blobFile.set(current, fileOf(folder));
        previous = current;
      });
    });
    if (wanted.length > MAX_IMPORT_REVISIONS) throw tooMany('revisions', 'too-many-revisions', MAX_IMPORT_REVISIONS);
    await report({ revisions_total: wanted.length });
    const uniqueBlobs = [...new Set(wanted.map((entry) => entry.blob))];
    const texts = await readBlobs(git, repo, uniqueBlobs, (blob) => blobFile.get(blob) ?? SETUP_FILE);
    const tags = await tagsByCommit(git, repo);

    return folders.map((folder, f): ImportedModel => {
      const mine = wanted.filter((entry) => entry.folder === f);
      const revisions = mine.map(({ commit, blob }) => {
        const info = commitInfo[commit];
        return {
          commit: info.oid,
          text: decodeText(texts.get(blob)!, info.oid, fileOf(folder)),
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
