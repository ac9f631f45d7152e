import { screen, within } from '@testing-library/react';
import { CLUB, demoUser, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { REVIEW, reviewDetail } from './review-data';

const path = `/w/${CLUB}/reviews/${REVIEW}`;

describe('the review page', () => {
  it('shows the compare against the parent, the findings, the checklist and carried comments', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
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
    const comments = screen.getByRole('list', { name: 'Comments' });
    expect(within(comments).getByText('From revision 3')).toBeInTheDocument();
    expect(within(comments).getByText('receivers[id=wing].map[pin=1]')).toBeInTheDocument();
    expect(document.title).toBe('Review · Kestrel Mk II, revision 4 · Bindery');
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
    expect(within(form).getByRole('radio', { name: /Comment/ })).toBeChecked();
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

  it('after approving, shows the caller’s standing approval and offers only to ask for changes or comment', async () => {
    let detail = reviewDetail();
    const me = { id: demoUser.id, name: demoUser.name };
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: detail } }),
      [`POST /api/reviews/${REVIEW}/verdicts`]: (request) => {
        const body = request.body as { verdict: 'approve' | 'comment'; body?: string };
        const entry = {
          id: `v${detail.verdicts.length + 1}`,
          reviewer: me,
          verdict: body.verdict,
          body: body.body ?? '',
          content_hash: detail.revision.content_hash,
          created_at: '2025-03-14T12:00:00.000Z',
        };
        detail = { ...detail, verdicts: [...detail.verdicts, entry] };
        return { status: 201, body: { data: { ...entry, review: { id: REVIEW, state: 'approved' } } } };
      },
    });
    const { user } = renderApp(path);

    const form = await screen.findByRole('form', { name: 'Give a verdict' });
    expect(within(form).getByRole('radio', { name: /Approve/ })).toBeChecked();
    await user.click(within(form).getByRole('button', { name: 'Approve' }));

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
    expect(within(form).getByRole('radio', { name: /Comment/ })).toBeChecked();

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
  });

  it('ticks a checklist item and adds an anchored comment', async () => {
    const detail = reviewDetail();
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      [`GET /api/reviews/${REVIEW}`]: () => ({ body: { data: detail } }),
      [`POST /api/reviews/${REVIEW}/checklist`]: () => ({
        body: { data: detail.checklist.map((item) => ({ ...item, ticked: true })) },
      }),
      [`POST /api/reviews/${REVIEW}/comments`]: (request) => {
        const body = request.body as { path: string; body: string };
        return {
          status: 201,
          body: {
            data: {
              id: 'c2',
              review_id: REVIEW,
              path: body.path,
              body: body.body,
              author: { id: 'me', name: 'Wren Calloway' },
              revision: { id: detail.revision.id, number: 4 },
              carried: false,
              created_at: new Date().toISOString(),
            },
          },
        };
      },
    });
    const { user } = renderApp(path);

    await user.click(await screen.findByRole('checkbox', { name: 'Failsafe tested' }));
    expect(await screen.findByText('2 of 2 ticked')).toBeInTheDocument();
    expect(server.called('POST', `/api/reviews/${REVIEW}/checklist`)[0].body).toEqual({
      item: 'failsafe-tested',
      ticked: true,
    });

    const form = screen.getByRole('form', { name: 'Add a comment' });
    await user.click(within(form).getByLabelText(/Anchor/));
    await user.paste('receivers[id=wing].map[pin=2]');
    await user.type(within(form).getByLabelText('Comment'), 'Nav lights hold on loss: fine.');
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
    expect(screen.queryByRole('form', { name: 'Add a comment' })).not.toBeInTheDocument();
    expect(screen.getByRole('checkbox', { name: 'Failsafe tested' })).toBeDisabled();
  });
});
