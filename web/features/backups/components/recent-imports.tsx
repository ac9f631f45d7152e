import type { ImportJob } from '../types';

const STATE_WORDS: Record<ImportJob['state'], string> = {
  queued: 'waiting',
  running: 'under way',
  done: 'imported',
  failed: 'refused',
};

function outcome(job: ImportJob): string {
  if (job.state === 'done') return `${job.models.map((entry) => entry.model.name).join(', ') || 'no models left'}`;
  if (job.state === 'failed') return job.error?.message ?? '';
  return '';
}

/** Earlier imports in a line each: the file, who sent it and when, and how it ended. */
export function RecentImports({ jobs }: { jobs: ImportJob[] }) {
  if (jobs.length === 0) return null;
  return (
    <section className="mt-6" aria-labelledby="recent-imports-heading">
      <h3 id="recent-imports-heading" className="text-base font-semibold text-ink-900">
        Earlier imports
      </h3>
      <ul className="mt-2 space-y-2 text-sm text-ink-700">
        {jobs.map((job) => (
          <li key={job.id}>
            <span className="font-medium text-ink-900">{job.file_name}</span>, {STATE_WORDS[job.state]}
            {' · '}
            {job.requested_by.name ?? 'a former member'}, {new Date(job.created_at).toLocaleString('en-GB')}
            {outcome(job) && <span className="block">{outcome(job)}</span>}
          </li>
        ))}
      </ul>
    </section>
  );
}
