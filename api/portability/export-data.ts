import { QueryTypes, type Sequelize } from 'sequelize';
import type { SetupModel } from '../models';
import { revisionFileName } from '../presenters/download-name';
import type { ExportModel } from './export-history';

interface RevisionRow {
  model_id: string;
  number: number;
  yaml_text: string;
  message: string;
  content_hash: string;
  created_at: Date;
  author_name: string | null;
  author_email: string | null;
  tags: string[] | null;
}

// One statement for the whole history of the models, tags folded in.
const HISTORY_SQL = `
  SELECT r.model_id, r.number, r.yaml_text, r.message, r.content_hash, r.created_at,
         u.name AS author_name, u.email AS author_email,
         (SELECT array_agg(t.name ORDER BY t.name) FROM tags t WHERE t.revision_id = r.id) AS tags
    FROM revisions r
    LEFT JOIN users u ON u.id = r.author_id
   WHERE r.model_id = ANY($modelIds::uuid[])
   ORDER BY r.model_id, r.number`;

/** The model's name as a folder: the download-name slug without its revision part. */
export const folderSlug = (name: string): string => revisionFileName(name, 1, '').replace(/-r1$/, '');

/** Distinct folder names in the models' order: `tern`, `tern-2`, ... */
function folderNames(models: readonly SetupModel[]): Map<string, string> {
  const used = new Set<string>();
  const names = new Map<string, string>();
  for (const model of models) {
    const base = folderSlug(model.name);
    let name = base;
    for (let n = 2; used.has(name); n++) name = `${base}-${n}`;
    used.add(name);
    names.set(model.id, name);
  }
  return names;
}

/** The models' histories as the exporter wants them; `inFolders` for a workspace export. */
export async function loadExportModels(
  sequelize: Sequelize,
  models: readonly SetupModel[],
  inFolders: boolean,
): Promise<ExportModel[]> {
  const rows = await sequelize.query<RevisionRow>(HISTORY_SQL, {
    bind: { modelIds: models.map((model) => model.id) },
    type: QueryTypes.SELECT,
  });
  const folders = folderNames(models);
  const byModel = new Map<string, ExportModel>(
    models.map((model) => [
      model.id,
      { name: model.name, folder: inFolders ? folders.get(model.id)! : null, revisions: [] },
    ]),
  );
  for (const row of rows) {
    byModel.get(row.model_id)!.revisions.push({
      number: row.number,
      yamlText: row.yaml_text,
      message: row.message,
      contentHash: row.content_hash,
      createdAt: new Date(row.created_at),
      authorName: row.author_name ?? 'Unknown pilot',
      authorEmail: row.author_email ?? 'unknown@bindery.invalid',
      tags: row.tags ?? [],
    });
  }
  return [...byModel.values()];
}
