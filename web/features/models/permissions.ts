import type { Role } from '../../types/api';

/** Owners and editors change models, revisions and tags; reviewers and viewers read (docs/design.md, roles). */
export const canEdit = (role: Role | null | undefined): boolean => role === 'owner' || role === 'editor';
