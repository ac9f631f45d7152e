import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { useMoreWorkspaces } from '../../auth/api/get-me';
import { useSession } from '../../auth/hooks/use-session';
import { useCurrentWorkspace } from '../hooks/use-current-workspace';

const SECTIONS = new Set(['hangar', 'shelf', 'reviews', 'team']);

/** Moves to the same screen of another workspace (or its hangar from elsewhere). */
export function WorkspaceSwitcher() {
  const { workspaces, workspacesTotal } = useSession();
  const more = useMoreWorkspaces();
  const { fallback, section } = useCurrentWorkspace();
  const navigate = useNavigate();

  if (workspaces.length === 0) return null;

  return (
    <div className="flex items-center gap-2">
      <SelectField
        label="Workspace"
        hideLabel
        className="max-w-xs min-w-48 lg:max-w-sm"
        value={fallback ? fallback.id : ''}
        onChange={(event) => {
          const target = section && SECTIONS.has(section) ? section : 'hangar';
          void navigate(`/w/${event.target.value}/${target}`);
        }}
      >
        {workspaces.map((ws) => (
          <option key={ws.id} value={ws.id}>
            {ws.name} ({ws.role})
          </option>
        ))}
      </SelectField>
      {workspacesTotal > workspaces.length && (
        <Button
          variant="quiet"
          size="sm"
          pending={more.isPending}
          title={more.isError ? more.error.message : undefined}
          onClick={() => more.mutate(workspaces.length)}
        >
          {more.isError ? 'Try again' : `More workspaces (${workspaces.length} of ${workspacesTotal})`}
        </Button>
      )}
    </div>
  );
}
