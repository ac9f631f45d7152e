import { Badge } from '../../../components/ui/badge';
import type { Role } from '../../../types/api';

const words: Record<Role, string> = { owner: 'Owner', editor: 'Editor', reviewer: 'Reviewer', viewer: 'Viewer' };

export function RoleBadge({ role }: { role: Role }) {
  return <Badge tone={role === 'owner' ? 'accent' : 'neutral'}>{words[role] ?? role}</Badge>;
}
