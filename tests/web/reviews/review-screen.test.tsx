import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { CLUB, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import type { CommentThread } from '@web/features/reviews/types';
import { renderApp } from '../render-app';
import { MODEL, REVIEW, carriedThread, reviewDetail, threadCounts, threadRoutes } from './review-data';

const path = `/w/${CLUB}/reviews/${REVIEW}`;

// The threads the fake comments route answers with; a test that starts one adds it here.
let threads: CommentThread[] = [];
beforeEach(() => {
  threads = [carriedThread];
});

describe('the review page', () => {
  it('shows the whole plan marked against the previous revision, the checklist with a carried tick and carried comments', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: reviewDetail() } }),
    });
    renderApp(path);

    expect(
      await screen.findByRole('heading', { name: 'Review of Kestrel Mk II, revision 4', level: 1 }),
    ).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'What changed since revision 3' })).toBeInTheDocument();
    expect(screen.getByText(/Compared with the revision before it, revision 3/)).toBeInTheDocument();
    // The real diff of the fixture pair: the wing receiver's pin 3 failsafe.
    expect(screen.getByText('Wing receiver pin 3: failsafe 988 -> 1500 µs')).toBeInTheDocument();
    expect(screen.getByRole('checkbox', { name: 'Ground range check' })).toBeChecked();
    expect(screen.getByRole('checkbox', { name: 'Failsafe tested' })).not.toBeChecked();
    expect(screen.getByText('1 of 2 ticked')).toBeInTheDocument();
    expect(
      screen.getByText('Carried from the review of revision 3: revision 4 leaves the link unchanged.'),
    ).toBeInTheDocument();
    // The plan: the changed failsafe's pin is marked, the others are the same.
    const wingPins = screen.getByRole('table', { name: 'Pins of receiver wing' });
    const pin3 = within(wingPins).getByRole('row', { name: /Pin 3/ });
    expect(within(pin3).getByText('Changed')).toBeInTheDocument();
    expect(within(pin3).getByText('1500 µs')).toBeInTheDocument();
    const comments = await screen.findByRole('list', { name: 'Open comments' });
    expect(within(comments).getByText('From revision 3')).toBeInTheDocument();
    expect(within(comments).getByText('Pin 1 of receiver wing')).toBeInTheDocument();
    expect(document.title).toBe('Review · Kestrel Mk II, revision 4 · Bindery');
  });

  it('opens the earlier history of a changed pin: each revision that changed it, with a compare against the one before', async () => {
    const pinPath = 'receivers[id=wing].map[pin=3]';
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: reviewDetail() } }),
      [`GET /api/models/${MODEL}/provenance/history`]: (request) => ({
        body: {
          data:
            request.url.searchParams.get('path') === pinPath
              ? [
                  {
                    revision: { id: 'rev-4', number: 4, parent_id: 'rev-3' },
                    origin_model_id: MODEL,
                    author: { id: 'u1', name: 'Ines Marchbank' },
                    created_at: '2025-02-16T10:00:00.000Z',
                    message: 'Wing pin 3 failsafe 988 -> 1500',
                    inherited: false,
                    paths: [`${pinPath}.failsafe`],
                  },
                  {
                    revision: { id: 'rev-1', number: 1, parent_id: null },
                    origin_model_id: MODEL,
                    author: { id: 'u2', name: demoUser.name },
                    created_at: '2025-01-05T09:00:00.000Z',
                    message: 'First setup',
                    inherited: false,
                    paths: [`${pinPath}.ch`, `${pinPath}.failsafe`],
                  },
                ]
              : [],
          pagination: { limit: 10, offset: 0, total: 2 },
        },
      }),
    });
    renderApp(path);
    const wingPins = await screen.findByRole('table', { name: 'Pins of receiver wing' });
    const pin3 = within(wingPins).getByRole('row', { name: /Pin 3/ });
    // Entries the same as the base have no history link; the changed pin has one, read when opened.
    const pin1 = within(wingPins).getByRole('row', { name: /Pin 1\b/ });
    expect(within(pin1).queryByText('Its history')).not.toBeInTheDocument();
    expect(server.called('GET', `/api/models/${MODEL}/provenance/history`)).toHaveLength(0);

    await userEvent.click(within(pin3).getByText('Its history'));
    expect(
      await within(pin3).findByText('r4, Ines Marchbank, 16 Feb 2025: ‘Wing pin 3 failsafe 988 -> 1500’'),
    ).toBeInTheDocument();
    expect(within(pin3).getByText(`r1, ${demoUser.name}, 5 Jan 2025: ‘First setup’`)).toBeInTheDocument();
    expect(within(pin3).getByRole('link', { name: 'compare r3 with r4' })).toHaveAttribute(
      'href',
      `/models/${MODEL}/compare?from=rev-3&to=rev-4`,
    );
    expect(within(pin3).getByText('(the first revision)')).toBeInTheDocument();
    const asked = server.called('GET', `/api/models/${MODEL}/provenance/history`);
    expect(asked.map((request) => request.url.searchParams.get('path'))).toContain(pinPath);
    expect(asked.every((request) => request.url.searchParams.get('path') === pinPath)).toBe(true);
  });

  it('gives a verdict with a text and shows the refusal when approving is not allowed', async () => {
    let detail = reviewDetail({
      can: {
        verdict: true,
        approve: false,
        approve_refusal: {
          code: 'own-revision',
          message: 'Nobody approves their own revision: ask another reviewer to sign it off.',
        },
        tick: true,
        comment: true,
      },
    });
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: detail } }),
      [`POST /api/reviews/${REVIEW}/verdicts`]: (request) => {
        const body = request.body as { verdict: 'comment'; body: string };
        detail = {
          ...detail,
          verdicts: [
            {
              id: 'v1',
              reviewer: { id: 'me', name: 'Wren Calloway' },
              verdict: body.verdict,
              body: body.body,
              content_hash: 'x',
              left_open: null,
              created_at: new Date().toISOString(),
            },
          ],
        };
        return { status: 201, body: { data: { ...detail.verdicts[0], review: { id: REVIEW, state: 'open' } } } };
      },
    });
    const { user } = renderApp(path);

    const form = await screen.findByRole('form', { name: 'Give a verdict' });
    const approve = within(form).getByRole('radio', { name: /Approve/ });
    expect(approve).toBeDisabled();
    expect(
      within(form).getByText('Nobody approves their own revision: ask another reviewer to sign it off.'),
    ).toBeInTheDocument();
    // Nothing is chosen for the reviewer.
    expect(
      within(form)
        .getAllByRole('radio')
        .filter((radio) => (radio as HTMLInputElement).checked),
    ).toEqual([]);
    await user.click(within(form).getByRole('radio', { name: /Comment/ }));
    await user.type(within(form).getByLabelText('What you found'), 'Pins checked on the bench.');
    await user.click(within(form).getByRole('button', { name: 'Comment' }));

    expect(server.called('POST', `/api/reviews/${REVIEW}/verdicts`)[0].body).toEqual({
      verdict: 'comment',
      body: 'Pins checked on the bench.',
    });
    const verdicts = await screen.findByRole('list', { name: 'Verdicts given' });
    expect(within(verdicts).getByText('Pins checked on the bench.')).toBeInTheDocument();
    expect(within(verdicts).getByText('Commented')).toBeInTheDocument();
  });

  it('confirms an approval with an item unticked, then shows the standing approval and what was left', async () => {
    let detail = reviewDetail();
    const me = { id: demoUser.id, name: demoUser.name };
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: detail } }),
      [`POST /api/reviews/${REVIEW}/verdicts`]: (request) => {
        const body = request.body as { verdict: 'approve' | 'comment'; body?: string; confirm_left_open?: boolean };
        const entry = {
          id: `v${detail.verdicts.length + 1}`,
          reviewer: me,
          verdict: body.verdict,
          body: body.body ?? '',
          content_hash: detail.revision.content_hash,
          left_open: body.confirm_left_open
            ? { unticked: [{ id: 'failsafe-tested', label: 'Failsafe tested' }], warnings: [] }
            : null,
          created_at: '2025-03-14T12:00:00.000Z',
        };
        detail = { ...detail, verdicts: [...detail.verdicts, entry] };
        return { status: 201, body: { data: { ...entry, review: { id: REVIEW, state: 'approved' } } } };
      },
    });
    const { user } = renderApp(path);

    const form = await screen.findByRole('form', { name: 'Give a verdict' });
    expect(within(form).getByRole('radio', { name: /Approve/ })).not.toBeChecked();
    await user.click(within(form).getByRole('button', { name: 'Give verdict' }));
    expect(within(form).getByText('Choose a verdict first.')).toBeInTheDocument();
    await user.click(within(form).getByRole('radio', { name: /Approve/ }));
    await user.click(within(form).getByRole('button', { name: 'Approve' }));
    const dialog = await screen.findByRole('dialog', { name: 'Approve with these left open?' });
    expect(within(dialog).getByText('Failsafe tested')).toBeInTheDocument();
    expect(server.called('POST', `/api/reviews/${REVIEW}/verdicts`)).toHaveLength(0);
    await user.click(within(dialog).getByRole('button', { name: 'Approve with these left' }));

    // The sentence holds a <time>, so it is matched on the paragraph's whole text.
    const standing = (pattern: RegExp) => (_: string, element: Element | null) =>
      element?.tagName === 'P' && pattern.test(element.textContent ?? '');
    expect(await screen.findByText(standing(/^You approved this revision on .*2025\.$/))).toBeInTheDocument();
    expect(within(form).queryByRole('radio', { name: /Approve/ })).not.toBeInTheDocument();
    expect(
      within(form)
        .getAllByRole('radio')
        .map((radio) => radio.getAttribute('value')),
    ).toEqual(['request-changes', 'comment']);
    expect(screen.getByText('Not ticked: Failsafe tested')).toBeInTheDocument();
    await user.click(within(form).getByRole('radio', { name: /Comment/ }));

    // A comment leaves the approval standing.
    await user.type(within(form).getByLabelText('What you found'), 'Receiver packs re-seated.');
    await user.click(within(form).getByRole('button', { name: 'Comment' }));
    await within(await screen.findByRole('list', { name: 'Verdicts given' })).findByText('Receiver packs re-seated.');
    expect(screen.getByText(standing(/^You approved this revision on .*2025\.$/))).toBeInTheDocument();
    expect(
      server
        .called('POST', `/api/reviews/${REVIEW}/verdicts`)
        .map((request) => (request.body as { verdict: string }).verdict),
    ).toEqual(['approve', 'comment']);
    expect(server.called('POST', `/api/reviews/${REVIEW}/verdicts`)[0].body).toMatchObject({ confirm_left_open: true });
  });

  it('ticks a checklist item and starts a thread by choosing a pin on the plan', async () => {
    let detail = reviewDetail();
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: detail } }),
      [`POST /api/reviews/${REVIEW}/checklist`]: () => ({
        body: { data: detail.checklist.map((item) => ({ ...item, ticked: true })) },
      }),
      [`POST /api/reviews/${REVIEW}/comments`]: (request) => {
        const body = request.body as { path: string; body: string };
        const thread = {
          id: 'c2',
          review_id: REVIEW,
          path: body.path,
          body: body.body,
          author: { id: 'me', name: 'Wren Calloway' },
          revision: { id: detail.revision.id, number: 4 },
          carried: false,
          created_at: new Date().toISOString(),
          replies: [],
          resolved: null,
        };
        threads = [...threads, thread];
        detail = { ...detail, threads: threadCounts(threads) };
        return { status: 201, body: { data: thread } };
      },
    });
    const { user } = renderApp(path);

    await user.click(await screen.findByRole('checkbox', { name: 'Failsafe tested' }));
    expect(await screen.findByText('2 of 2 ticked')).toBeInTheDocument();
    expect(server.called('POST', `/api/reviews/${REVIEW}/checklist`)[0].body).toEqual({
      item: 'failsafe-tested',
      ticked: true,
    });

    await user.click(screen.getByRole('button', { name: 'Comment on Pin 2 of receiver wing' }));
    const form = screen.getByRole('form', { name: 'Start a comment' });
    const box = within(form).getByLabelText('Comment on Pin 2 of receiver wing');
    expect(box).toHaveFocus();
    await user.type(box, 'Nav lights hold on loss: fine.');
    await user.click(within(form).getByRole('button', { name: 'Add comment' }));
    expect(await screen.findByText('Nav lights hold on loss: fine.')).toBeInTheDocument();
    expect(server.called('POST', `/api/reviews/${REVIEW}/comments`)[0].body).toEqual({
      path: 'receivers[id=wing].map[pin=2]',
      body: 'Nav lights hold on loss: fine.',
    });
  });

  it('lets a viewer read without the verdict form', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({
        body: {
          data: reviewDetail({
            can: { verdict: false, approve: false, approve_refusal: null, tick: false, comment: false },
          }),
        },
      }),
    });
    renderApp(path);
    expect(await screen.findByText(/your role here lets you read the review/)).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Give a verdict' })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Start a comment' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Comment on/ })).not.toBeInTheDocument();
    expect(screen.getByRole('checkbox', { name: 'Failsafe tested' })).toBeDisabled();
  });
});

describe('the review page’s comments', () => {
  it('reads the threads a page at a time from the revision’s comments, with how many of how many and Show more', async () => {
    threads = Array.from({ length: 25 }, (_, i) => ({
      ...carriedThread,
      id: `t${i + 1}`,
      body: `Note ${i + 1} on the tailwheel.`,
    }));
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...threadRoutes(() => threads),
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: reviewDetail({ threads: threadCounts(threads) }) } }),
    });
    const { user } = renderApp(path);

    const list = await screen.findByRole('list', { name: 'Open comments' });
    expect(within(list).getAllByRole('listitem', { name: /^Comment on/ })).toHaveLength(20);
    expect(screen.getByText('Showing 20 of 25 open comments.')).toBeInTheDocument();
    expect(screen.getByText('25 open, 0 resolved')).toBeInTheDocument();
    // The plan counts the pin's open threads from the review answer's summary.
    const wingPins = screen.getByRole('table', { name: 'Pins of receiver wing' });
    expect(within(wingPins).getByText('(25 open comments)')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Show more' }));
    expect(await screen.findByText('Note 25 on the tailwheel.')).toBeInTheDocument();
    expect(within(list).getAllByRole('listitem', { name: /^Comment on/ })).toHaveLength(25);
    expect(screen.queryByRole('button', { name: 'Show more' })).not.toBeInTheDocument();
    const pages = server
      .called('GET', `/api/revisions/${reviewDetail().revision.id}/comments`)
      .filter((request) => request.url.searchParams.get('status') === 'open')
      .map((request) => request.url.searchParams.get('offset'));
    expect([...new Set(pages)]).toEqual(['0', '20']);
  });
});
