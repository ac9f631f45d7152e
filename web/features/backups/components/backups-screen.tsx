import { PageHeader } from '../../../components/ui/page-header';
import { useCurrentWorkspace } from '../../workspaces/hooks/use-current-workspace';
import { ExportWorkspaceCard } from './export-workspace-card';
import { ImportHistoryCard } from './import-history-card';

// Backups of a whole workspace and imports of a kept history: where a club's
// secretary looks to keep the records safe, or to bring them into a new workspace.
export function BackupsScreen() {
  const { inUrl } = useCurrentWorkspace();
  if (!inUrl) return null;
  return (
    <>
      <PageHeader
        title="Backups"
        documentTitle={`Backups · ${inUrl.name}`}
        description={`Keep a copy of every model’s history in ${inUrl.name}, or bring in a history kept elsewhere.`}
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <ExportWorkspaceCard workspace={inUrl} />
        <ImportHistoryCard workspace={inUrl} />
      </div>
    </>
  );
}
