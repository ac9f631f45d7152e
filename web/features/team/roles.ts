import type { Role } from '../../types/api';

export const ROLE_CHOICES: { value: Role; label: string; hint: string }[] = [
  { value: 'viewer', label: 'Viewer', hint: 'reads everything' },
  { value: 'reviewer', label: 'Reviewer', hint: 'reads everything and gives verdicts' },
  { value: 'editor', label: 'Editor', hint: 'changes models, revisions and receivers' },
  { value: 'owner', label: 'Owner', hint: 'members, roles and everything else' },
];

/** "an editor", "a viewer"; bare: "editor". */
export function roleWord(role: Role, withArticle = false): string {
  if (!withArticle) return role;
  return `${role === 'owner' || role === 'editor' ? 'an' : 'a'} ${role}`;
}
