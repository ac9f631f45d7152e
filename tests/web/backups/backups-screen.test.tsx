import { screen, within } from '@testing-library/react';
import { BUILDERS, CLUB, apiError, demoUser, fakeServer, sessionRoutes, type FakeHandler } from '../fake-server';
import { renderApp } from '../render-app';

const JOB = '0d6f3b2a-8c41-4e7a-9b15-3f2e6a7c9d04';
const KESTREL = '7a1e5c3b-2d94-4f60-8b27-c5e9a1d3f086';
const HARRIER = '3c8b1f6e-5a27-4d93-a0e4-9f2b7c6d1e58';

function job(overrides: Record<string, unknown> = {}) {
  return {
    id: JOB,
    workspace_id: CLUB,
    state: 'queued',
    file_name: 'club-history.bundle',
    bundle_bytes: 2048,
    requested_by: { id: demoUser.id, name: demoUser.name },
    progress: { commits_total: null, commits_read: 0, revisions_total: null, revisions_checked: 0, revisions_stored: 0 },
    error: null,
    models: [],
    created_at: new Date().toISOString(),
    started_at: null,
    finished_at: null,
    ...overrides,
  };
}

/** The job's answers in turn, the last one repeated. */
function jobRoutes(answers: ReturnType<typeof job>[], upload?: FakeHandler, recent: unknown[] = []) {
  let asked = 0;
  return {
    ...sessionRoutes({ signedIn: true }).routes,
    [`GET /api/workspaces/${CLUB}/imports`]: () => ({ body: { data: recent } }),
    [`POST /api/workspaces/${CLUB}/import`]: upload ?? (() => ({ status: 202, body: { data: job() } })),
    [`GET /api/workspaces/${CLUB}/imports/${JOB}`]: () => ({
      body: { data: answers[Math.min(asked++, answers.length - 1)] },
    }),
  };
}

async function chooseAndImport(user: ReturnType<typeof renderApp>['user'], file: File) {
  const form = await screen.findByRole('form', { name: 'Import history' });
  await user.upload(within(form).getByLabelText('Backup file (.bundle)'), file);
  await user.click(within(form).getByRole('button', { name: 'Import' }));
}

const bundleFile = () => new File(['# v2 git bundle\n'], 'club-history.bundle', { type: 'application/octet-stream' });

describe('Backups', () => {
  it('offers the workspace backup as a download, said in plain words', async () => {
    fakeServer(jobRoutes([job()]));
    renderApp(`/w/${CLUB}/backups`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Backups' })).toBeInTheDocument();
    const link = screen.getByRole('link', { name: 'Download workspace backup' });
    expect(link).toHaveAttribute('href', `/api/workspaces/${CLUB}/export.git`);
    expect(link).toHaveAttribute('download');
    expect(link).toHaveAccessibleDescription(/a backup file you can open with git: one commit per revision/i);
  });

  it('uploads a bundle, shows the job going on, and links to the models it made', async () => {
    const server = fakeServer(
      jobRoutes([
        job({
          state: 'running',
          progress: {
            commits_total: 40,
            commits_read: 40,
            revisions_total: 40,
            revisions_checked: 12,
            revisions_stored: 0,
          },
        }),
        job({
          state: 'done',
          models: [
            { model: { id: KESTREL, name: 'Kestrel 2.4' }, revisions: 25, tags: 1 },
            { model: { id: HARRIER, name: 'Harrier trainer' }, revisions: 15, tags: 0 },
          ],
        }),
      ]),
    );
    const { user } = renderApp(`/w/${CLUB}/backups`);
    await chooseAndImport(user, bundleFile());

    const [upload] = server.called('POST', `/api/workspaces/${CLUB}/import`);
    expect((upload.form?.get('file') as File).name).toBe('club-history.bundle');
    expect(await screen.findByText('Checking setups: 12 of 40 revisions…')).toBeInTheDocument();
    expect(
      await screen.findByText('Imported 2 models with 40 revisions from club-history.bundle.', {}, { timeout: 3000 }),
    ).toBeInTheDocument();
    const list = screen.getByRole('list', { name: 'Imported models' });
    expect(within(list).getByRole('link', { name: 'Kestrel 2.4' })).toHaveAttribute('href', `/models/${KESTREL}/overview`);
    expect(within(list).getByRole('link', { name: 'Harrier trainer' })).toHaveAttribute(
      'href',
      `/models/${HARRIER}/overview`,
    );
  });

  it('shows a refused import with the server’s reason', async () => {
    const reason =
      'The message of commit 1a2b3c4d5e6f is 3145728 characters; a revision message takes at most 2000 characters, as for a save. Nothing was imported.';
    fakeServer(
      jobRoutes([job({ state: 'failed', error: { status: 422, code: 'message-too-long', message: reason } })]),
    );
    const { user } = renderApp(`/w/${CLUB}/backups`);
    await chooseAndImport(user, bundleFile());
    expect(await screen.findByRole('alert')).toHaveTextContent(`Nothing was imported from club-history.bundle. ${reason}`);
    expect(screen.queryByRole('list', { name: 'Imported models' })).not.toBeInTheDocument();
  });

  it('shows a refusal at upload, and asks for a file before sending', async () => {
    const server = fakeServer(
      jobRoutes([job()], () =>
        apiError(415, 'not-a-git-bundle', 'This file is not a git bundle. Upload the .bundle file a history export gave you.'),
      ),
    );
    const { user } = renderApp(`/w/${CLUB}/backups`);
    const form = await screen.findByRole('form', { name: 'Import history' });
    await user.click(within(form).getByRole('button', { name: 'Import' }));
    expect(within(form).getByRole('alert')).toHaveTextContent('Choose the .bundle file to import.');
    expect(server.called('POST', `/api/workspaces/${CLUB}/import`)).toHaveLength(0);

    await chooseAndImport(user, new File(['model: {}\n'], 'renamed-setup.bundle'));
    expect(await within(form).findByText(/This file is not a git bundle\./)).toBeInTheDocument();
    expect(server.called('GET', `/api/workspaces/${CLUB}/imports/${JOB}`)).toHaveLength(0);
  });

  it('follows an import still going on when the screen opens, and lists earlier ones with how they ended', async () => {
    const running = job({
      state: 'running',
      progress: { commits_total: 900, commits_read: 300, revisions_total: null, revisions_checked: 0, revisions_stored: 0 },
    });
    const earlier = job({
      id: '5e2a9c71-0b3d-4f84-a6e2-7d1c3b9f0a25',
      state: 'failed',
      file_name: 'old-laptop.bundle',
      error: { status: 422, code: 'author-date-out-of-range', message: 'Commit 9f8e7d6c5b4a has the date 5138-03-02.' },
    });
    const server = fakeServer(jobRoutes([running], undefined, [running, earlier]));
    renderApp(`/w/${CLUB}/backups`);
    expect(await screen.findByText('Reading the history: 300 of 900 commits…')).toBeInTheDocument();
    const list = screen.getByRole('region', { name: 'Earlier imports' });
    expect(list).toHaveTextContent('old-laptop.bundle, refused');
    expect(list).toHaveTextContent('Commit 9f8e7d6c5b4a has the date 5138-03-02.');
    expect(list).not.toHaveTextContent('club-history.bundle');
    expect(server.called('POST', `/api/workspaces/${CLUB}/import`)).toHaveLength(0);
  });

  it('lets a reviewer download the backup but not import', async () => {
    fakeServer(sessionRoutes({ signedIn: true }).routes);
    renderApp(`/w/${BUILDERS}/backups`);
    expect(await screen.findByRole('link', { name: 'Download workspace backup' })).toHaveAttribute(
      'href',
      `/api/workspaces/${BUILDERS}/export.git`,
    );
    expect(screen.queryByRole('form', { name: 'Import history' })).not.toBeInTheDocument();
    expect(screen.getByText(/Importing needs the editor role or higher/)).toBeInTheDocument();
  });
});
