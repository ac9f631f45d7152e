import path from 'node:path';
import { readFile } from 'node:fs/promises';
import { formatCommitMessage } from './commit-message';
import { withGit } from './git-cli';

// A model's or a workspace's history as a git repository, packed as a git bundle (one
// file that `git clone` reads directly). One commit per revision on `main`, in order:
// the revision's author and time, its message, the file `setup.yaml` holding the
// exact stored text; each tag a git tag on its revision's commit. A workspace export
// keeps each model in a folder of its own (`<folder>/setup.yaml`, tags
// `<folder>/<tag>`), with the revisions of all models in time order.
// Written with `git fast-import`: one process for the whole history, exact bytes for
// texts and messages, and the same history always gives the same commit ids.

export interface ExportRevision {
  number: number;
  yamlText: string;
  message: string;
  contentHash: string;
  createdAt: Date;
  authorName: string;
  authorEmail: string;
  tags: string[];
}

export interface ExportModel {
  name: string;
  /** The model's folder in a workspace export; null puts `setup.yaml` at the top. */
  folder: string | null;
  revisions: ExportRevision[];
}

export const SETUP_FILE = 'setup.yaml';
export const BRANCH = 'main';

function identity(name: string, email: string, when: Date): string {
  const cleanName = name.replace(/[<>\r\n]/g, '').trim() || 'Unknown pilot';
  const cleanEmail = email.replace(/[<>\s]/g, '') || 'unknown@bindery.invalid';
  return `${cleanName} <${cleanEmail}> ${Math.floor(when.getTime() / 1000)} +0000`;
}

function data(text: string): Buffer[] {
  const bytes = Buffer.from(text, 'utf8');
  return [Buffer.from(`data ${bytes.length}\n`), bytes, Buffer.from('\n')];
}

interface Step {
  model: ExportModel;
  revision: ExportRevision;
}

/** Each model's revisions in number order, all models merged by time (stable). */
function inTimeOrder(models: ExportModel[]): Step[] {
  const queues = models.map((model) => ({
    model,
    revisions: [...model.revisions].sort((a, b) => a.number - b.number),
    next: 0,
  }));
  const steps: Step[] = [];
  for (;;) {
    let pick: (typeof queues)[number] | null = null;
    for (const queue of queues) {
      if (queue.next >= queue.revisions.length) continue;
      if (!pick || queue.revisions[queue.next].createdAt.getTime() < pick.revisions[pick.next].createdAt.getTime())
        pick = queue;
    }
    if (!pick) return steps;
    steps.push({ model: pick.model, revision: pick.revisions[pick.next++] });
  }
}

export function fastImportStream(models: ExportModel[]): Buffer {
  const parts: Buffer[] = [];
  const tags: { ref: string; mark: number }[] = [];
  let mark = 0;
  let previous: number | null = null;
  for (const { model, revision } of inTimeOrder(models)) {
    const blob = ++mark;
    parts.push(Buffer.from(`blob\nmark :${blob}\n`), ...data(revision.yamlText));
    const commit = ++mark;
    const who = identity(revision.authorName, revision.authorEmail, revision.createdAt);
    const message = formatCommitMessage(revision.message, {
      folder: model.folder ?? undefined,
      modelName: model.name,
      number: revision.number,
      contentHash: revision.contentHash,
    });
    parts.push(
      Buffer.from(`commit refs/heads/${BRANCH}\nmark :${commit}\nauthor ${who}\ncommitter ${who}\n`),
      ...data(message),
    );
    if (previous !== null) parts.push(Buffer.from(`from :${previous}\n`));
    parts.push(Buffer.from(`M 100644 :${blob} ${model.folder ? `${model.folder}/` : ''}${SETUP_FILE}\n\n`));
    previous = commit;
    for (const tag of revision.tags)
      tags.push({ ref: `refs/tags/${model.folder ? `${model.folder}/` : ''}${tag}`, mark: commit });
  }
  for (const tag of tags) parts.push(Buffer.from(`reset ${tag.ref}\nfrom :${tag.mark}\n\n`));
  parts.push(Buffer.from('done\n'));
  return Buffer.concat(parts);
}

/** The history as a git bundle. */
export function exportHistoryBundle(models: ExportModel[]): Promise<Buffer> {
  return withGit(async (git) => {
    const repo = path.join(git.dir, 'history.git');
    await git.run(['init', '--quiet', '--bare', '--initial-branch', BRANCH, repo]);
    await git.run(['fast-import', '--quiet', '--done', '--date-format=raw'], {
      cwd: repo,
      input: fastImportStream(models),
    });
    const bundle = path.join(git.dir, 'history.bundle');
    await git.run(['bundle', 'create', '--quiet', bundle, '--all'], { cwd: repo });
    return readFile(bundle);
  });
}
