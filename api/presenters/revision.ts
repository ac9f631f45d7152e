import type {
  Author,
  LatestRevision,
  Revision as PresentedRevision,
  RevisionSummary,
  SavedRevision,
} from '@shared/contract/model';
import type { Revision, User } from '../models';

export function presentAuthor(user: Pick<User, 'id' | 'name'> | null | undefined): Author | null {
  return user ? { id: user.id, name: user.name } : null;
}

/**
 * What a summary is made of: a Revision instance, a row read under the same attribute
 * names (the compare reads its sides without Sequelize's models), or the plain facts a
 * save knows.
 */
export type RevisionSummaryFields = Pick<
  Revision,
  | 'id'
  | 'modelId'
  | 'number'
  | 'parentId'
  | 'message'
  | 'contentHash'
  | 'errorCount'
  | 'warningCount'
  | 'infoCount'
  | 'origin'
  | 'sourceRevisionId'
  | 'createdAt'
> & { author?: Pick<User, 'id' | 'name'> | null; tags?: readonly { name: string }[] };

/** What a save's answer reads: the summary's fields and the findings. */
export type SavedRevisionFacts = RevisionSummaryFields & Pick<Revision, 'findings'>;

/** A revision without its text and document: for history lists and answers to saves. */
export function presentRevisionSummary(
  revision: RevisionSummaryFields,
  tags: readonly string[] = revision.tags?.map((tag) => tag.name) ?? [],
): RevisionSummary {
  return {
    id: revision.id,
    model_id: revision.modelId,
    number: revision.number,
    parent_id: revision.parentId,
    author: presentAuthor(revision.author),
    message: revision.message,
    content_hash: revision.contentHash,
    error_count: revision.errorCount,
    warning_count: revision.warningCount,
    info_count: revision.infoCount,
    origin: revision.origin,
    source_revision_id: revision.sourceRevisionId,
    tags: [...tags].sort(),
    created_at: revision.createdAt.toISOString(),
  };
}

/** What a save answers: the summary and the findings the checks gave. */
export function presentSavedRevision(revision: SavedRevisionFacts): SavedRevision {
  return { ...presentRevisionSummary(revision), findings: revision.findings };
}

/** Everything about one revision, its exact YAML text included. */
export function presentRevision(revision: Revision, tags?: readonly string[]): PresentedRevision {
  return {
    ...presentRevisionSummary(revision, tags),
    yaml: revision.yamlText,
    document: revision.document,
    findings: revision.findings,
  };
}

/** The latest revision as the hangar and the model page show it. */
export function presentLatest(revision: Revision): LatestRevision {
  return {
    id: revision.id,
    number: revision.number,
    content_hash: revision.contentHash,
    error_count: revision.errorCount,
    warning_count: revision.warningCount,
    info_count: revision.infoCount,
    message: revision.message,
    created_at: revision.createdAt.toISOString(),
    author: presentAuthor(revision.author),
  };
}

export type { PresentedRevision, RevisionSummary as PresentedRevisionSummary };
