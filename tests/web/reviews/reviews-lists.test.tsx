import { screen, within } from '@testing-library/react';
import { CLUB, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { MODEL, ines, reviewDetail, summaryOf } from './review-data';

const open = summaryOf(reviewDetail(), { reviewers: [{ id: demoUser.id, name: demoUser.name }] });
const decided = summaryOf(reviewDetail(), {
  id: '66666666-6666-4666-8666-666666666666',
  model: { id: MODEL, name: 'Meadowlark 40' },
  state: 'approved',
  decided_at: '2026-04-03T09:00:00.000Z',
  latest: { id: 'x', number: 5, same_content: false },
});

describe('the workspace’s reviews', () => {
  it('lists open reviews apart from decided ones, with links to each', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${CLUB}/reviews`]: ({ url }) => {
        const rows = url.searchParams.get('status') === 'open' ? [open] : [decided];
        return { body: { data: rows, pagination: { limit: 50, offset: 0, total: 1 } } };
      },
    });
    renderApp(`/w/${CLUB}/reviews`);

    const openTable = await screen.findByRole('table', { name: 'Open reviews' });
    expect(within(openTable).getByRole('link', { name: 'Kestrel Mk II, revision 4' })).toHaveAttribute(
      'href',
      `/w/${CLUB}/reviews/${open.id}`,
    );
    expect(within(openTable).getByText('Review pending')).toBeInTheDocument();
    expect(screen.getByText('1 open, 1 asking you')).toBeInTheDocument();
    const past = screen.getByRole('table', { name: 'Decided reviews' });
    expect(within(past).getByText('Approved')).toBeInTheDocument();
    expect(within(past).getByText('Revision 5 is newer')).toBeInTheDocument();
  });

  it('shows how many there are and fetches the next page when asked', async () => {
    const older = Array.from({ length: 3 }, (_, index) =>
      summaryOf(reviewDetail(), {
        id: `7777777${index}-7777-4777-8777-777777777777`,
        state: 'approved',
        decided_at: '2026-04-03T09:00:00.000Z',
        revision: { ...decided.revision, number: index + 1 },
      }),
    );
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${CLUB}/reviews`]: ({ url }) => {
        if (url.searchParams.get('status') === 'open')
          return { body: { data: [], pagination: { limit: 50, offset: 0, total: 0 } } };
        const offset = Number(url.searchParams.get('offset'));
        // The server's page holds two here, so the third is on a page of its own.
        return { body: { data: older.slice(offset, offset + 2), pagination: { limit: 50, offset, total: 3 } } };
      },
    });
    const { user } = renderApp(`/w/${CLUB}/reviews`);

    const past = await screen.findByRole('table', { name: 'Decided reviews' });
    expect(within(past).getAllByRole('row')).toHaveLength(3);
    expect(screen.getByText('Showing 2 of 3 decided reviews.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Show more' }));
    await vi.waitFor(() =>
      expect(within(screen.getByRole('table', { name: 'Decided reviews' })).getAllByRole('row')).toHaveLength(4),
    );
    expect(screen.queryByRole('button', { name: 'Show more' })).not.toBeInTheDocument();
    const asked = server.called('GET', `/api/workspaces/${CLUB}/reviews`).map((request) => request.url.search);
    expect(asked).toContain('?status=closed&limit=50&offset=2');
  });

  it('says how to start when there are none', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/workspaces/${CLUB}/reviews`]: () => ({ body: { data: [] } }),
    });
    renderApp(`/w/${CLUB}/reviews`);
    expect(await screen.findByRole('heading', { name: 'No reviews yet' })).toBeInTheDocument();
  });
});

describe('the model’s Reviews tab', () => {
  const model = {
    id: MODEL,
    workspace_id: CLUB,
    name: 'Kestrel Mk II',
    airframe: 'airplane',
    forked_from_revision_id: null,
    forked_from: null,
    created_by: demoUser.id,
    created_at: '2026-01-01T00:00:00.000Z',
    updated_at: '2026-01-01T00:00:00.000Z',
    latest: {
      id: 'rev-12',
      number: 12,
      content_hash: 'a'.repeat(64),
      error_count: 0,
      warning_count: 0,
      info_count: 0,
      message: 'm',
      created_at: '2026-03-21T09:40:00.000Z',
      author: { id: demoUser.id, name: demoUser.name },
    },
    review_state: 'stale',
    cleared_for_maiden: false,
    role: 'owner',
  };

  it('requests a review of the latest revision from chosen reviewers, never its author', async () => {
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/models/${MODEL}`]: () => ({ body: { data: model } }),
      [`GET /api/models/${MODEL}/reviews`]: () => ({ body: { data: [] } }),
      [`GET /api/workspaces/${CLUB}/members`]: () => ({
        body: {
          data: [
            { user: demoUser, role: 'owner' },
            { user: { ...ines, email: 'ines@example.org' }, role: 'reviewer' },
            { user: { id: 'viewer-1', name: 'Rafe Dunmoor', email: 'rafe@example.org' }, role: 'viewer' },
          ],
        },
      }),
      'POST /api/revisions/rev-12/reviews': () => ({
        status: 201,
        body: { data: { ...open, id: 'new-review', reviewers: [ines] } },
      }),
      [`GET /api/reviews/new-review`]: () => ({ body: { data: reviewDetail({ id: 'new-review' }) } }),
    });
    const { user, location } = renderApp(`/models/${MODEL}/reviews`);

    expect(
      await screen.findByText(/An earlier revision was approved, but the setup has changed since/),
    ).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Request review' }));
    const dialog = await screen.findByRole('dialog', { name: 'Request a review of revision 12' });
    const choices = within(dialog).getAllByRole('checkbox');
    expect(choices.map((box) => box.closest('label')!.textContent)).toEqual(['Ines MarchbankReviewer']);
    await user.click(choices[0]);
    await user.type(within(dialog).getByLabelText('Note (optional)'), 'Maiden Saturday');
    await user.click(within(dialog).getByRole('button', { name: 'Request review' }));

    await vi.waitFor(() => expect(location().pathname).toBe(`/w/${CLUB}/reviews/new-review`));
    expect(server.called('POST', '/api/revisions/rev-12/reviews')[0].body).toEqual({
      reviewers: [ines.id],
      note: 'Maiden Saturday',
    });
  });
});
