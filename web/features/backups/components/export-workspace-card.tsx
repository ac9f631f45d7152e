import { useId } from 'react';
import { Card } from '../../../components/ui/card';
import { buttonClasses } from '../../../components/ui/button';
import type { WorkspaceMembership } from '../../../types/api';
import { paths } from '../../../lib/api-paths';

/**
 * The whole workspace as one git bundle. A plain link, so the browser saves the file
 * with the session cookie and no script in between.
 */
export function ExportWorkspaceCard({ workspace }: { workspace: WorkspaceMembership }) {
  const headingId = useId();
  const descriptionId = useId();
  return (
    <Card className="p-5" role="region" aria-labelledby={headingId}>
      <h2 id={headingId} className="text-lg font-semibold text-ink-900">
        Export workspace
      </h2>
      <p id={descriptionId} className="mt-2 max-w-prose text-base text-ink-700">
        A backup file you can open with git: one commit per revision, each model in a folder of its own, with every
        message, date and tag of {workspace.name}.
      </p>
      <a
        href={paths.workspaceExport(workspace.id)}
        download
        className={`${buttonClasses('secondary', 'md')} mt-4`}
        aria-describedby={descriptionId}
      >
        Download workspace backup
      </a>
      <p className="mt-3 max-w-prose text-sm text-ink-700">
        Keep it somewhere safe. <code className="font-mono">git clone</code> on the file shows a folder per model; to
        bring the history back, import the file below, here or in another workspace.
      </p>
    </Card>
  );
}
