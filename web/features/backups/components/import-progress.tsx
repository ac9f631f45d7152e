import { Link } from 'react-router-dom';
import { FormAlert } from '../../../components/ui/form-alert';
import { Spinner } from '../../../components/ui/spinner';
import type { ImportJob } from '../types';

const count = (value: number, word: string) => `${value.toLocaleString('en')} ${word}${value === 1 ? '' : 's'}`;

function progressLine(job: ImportJob): string {
  const { progress } = job;
  if (job.state === 'queued') return 'Waiting for its turn…';
  if (progress.revisions_total === null) {
    return progress.commits_total === null
      ? 'Opening the file…'
      : `Reading the history: ${progress.commits_read.toLocaleString('en')} of ${count(progress.commits_total, 'commit')}…`;
  }
  if (progress.revisions_checked < progress.revisions_total)
    return `Checking setups: ${progress.revisions_checked.toLocaleString('en')} of ${count(progress.revisions_total, 'revision')}…`;
  return `Saving: ${progress.revisions_stored.toLocaleString('en')} of ${count(progress.revisions_total, 'revision')}…`;
}

/** Where an import stands: how far it got, or what it made, or why it was refused. */
export function ImportProgress({ job }: { job: ImportJob }) {
  if (job.state === 'failed') {
    return <FormAlert>{`Nothing was imported from ${job.file_name}. ${job.error?.message ?? ''}`.trim()}</FormAlert>;
  }
  if (job.state === 'done') {
    const revisions = job.models.reduce((sum, entry) => sum + entry.revisions, 0);
    return (
      <div className="space-y-3">
        <FormAlert tone="success">{`Imported ${count(job.models.length, 'model')} with ${count(revisions, 'revision')} from ${job.file_name}.`}</FormAlert>
        <ul className="space-y-1" aria-label="Imported models">
          {job.models.map(({ model, revisions: made }) => (
            <li key={model.id}>
              <Link to={`/models/${model.id}/overview`} className="font-medium">
                {model.name}
              </Link>{' '}
              <span className="text-sm text-ink-700">({count(made, 'revision')})</span>
            </li>
          ))}
        </ul>
      </div>
    );
  }
  return (
    <p className="flex items-center gap-2 text-base text-ink-700">
      <Spinner />
      {progressLine(job)}
    </p>
  );
}
