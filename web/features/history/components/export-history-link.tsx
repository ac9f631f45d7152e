import { useId } from 'react';
import { buttonClasses } from '../../../components/ui/button';
import { paths } from '../../../lib/api-paths';

const DESCRIPTION =
  'A backup file of the whole history, one entry per revision. Git (a common version-control tool) opens it; Backups can bring it back into Bindery.';

/**
 * The model's whole history as a git bundle: `git clone` it to get a plain repository
 * with one commit per revision, setup.yaml and the tags. A plain link, so the browser
 * saves the file with the session cookie and no script in between. Its words avoid
 * "git" up front, which most pilots would not know; the description says what it is.
 */
export function ExportHistoryLink({ modelId }: { modelId: string }) {
  const descriptionId = useId();
  return (
    <div className="flex flex-col items-start gap-1 sm:items-end">
      <a
        href={paths.modelExport(modelId)}
        download
        className={buttonClasses('secondary', 'sm')}
        aria-describedby={descriptionId}
        title={`${DESCRIPTION} Saved as a git bundle: open it with git clone.`}
      >
        Export full history
      </a>
      <p id={descriptionId} className="max-w-xs text-sm text-ink-700 sm:text-right">
        {DESCRIPTION}
      </p>
    </div>
  );
}
