import { buttonClasses } from '../../../components/ui/button';

/**
 * The model's whole history as a git bundle: `git clone` it to get a plain repository
 * with one commit per revision, setup.yaml and the tags. A plain link, so the browser
 * saves the file with the session cookie and no script in between.
 */
export function ExportHistoryLink({ modelId }: { modelId: string }) {
  return (
    <a
      href={`/api/models/${encodeURIComponent(modelId)}/export.git`}
      download
      className={buttonClasses('secondary', 'sm')}
      title="A git bundle of every revision: open it with git clone"
    >
      Download history (git)
    </a>
  );
}
