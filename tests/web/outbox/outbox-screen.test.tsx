import { screen, within } from '@testing-library/react';
import { apiError, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';

const invitation = {
  id: 'm2',
  message_id: '<a@b>',
  from: 'Bindery <bindery@localhost>',
  to: ['pip@example.org'],
  to_header: 'pip@example.org',
  subject: 'Wren Calloway invites you to Hollowfield Aero Club on Bindery',
  text: 'Hello,\n\nAccept the invitation:\nhttp://127.0.0.1:3000/invitations/abc.def.ghi\n\nThe link works once.',
  html: '<p>Hello</p>',
  links: ['http://127.0.0.1:3000/invitations/abc.def.ghi'],
  size_bytes: 300,
  received_at: new Date().toISOString(),
};
const reset = {
  ...invitation,
  id: 'm1',
  to: ['juno@example.org'],
  subject: 'Choose a new Bindery password',
  text: 'Reset: http://127.0.0.1:3000/reset-password/x.y.z',
  links: ['http://127.0.0.1:3000/reset-password/x.y.z'],
  received_at: new Date(Date.now() - 60_000).toISOString(),
};

describe('Outbox', () => {
  it('lists caught mail newest first and shows the open one with clickable links', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      'GET /api/outbox': () => ({ body: { data: [invitation, reset], pagination: { total: 2 } } }),
    });
    const { user } = renderApp('/outbox');

    const list = await screen.findByRole('list', { name: 'Caught messages' });
    expect(
      within(list)
        .getAllByRole('button')
        .map((button) => button.textContent),
    ).toEqual([
      expect.stringContaining('invites you to Hollowfield Aero Club'),
      expect.stringContaining('Choose a new Bindery password'),
    ]);
    expect(screen.getByRole('heading', { name: invitation.subject, level: 2 })).toBeInTheDocument();
    const links = screen.getAllByRole('link', { name: 'http://127.0.0.1:3000/invitations/abc.def.ghi' });
    expect(links.length).toBe(2);
    for (const link of links) expect(link).toHaveAttribute('href', 'http://127.0.0.1:3000/invitations/abc.def.ghi');

    await user.click(within(list).getByRole('button', { name: /Choose a new Bindery password/ }));
    expect(screen.getByRole('heading', { name: 'Choose a new Bindery password', level: 2 })).toBeInTheDocument();
    expect(screen.getAllByRole('link', { name: 'http://127.0.0.1:3000/reset-password/x.y.z' })[0]).toHaveAttribute(
      'href',
      'http://127.0.0.1:3000/reset-password/x.y.z',
    );
  });

  it('says so when nothing has been sent yet', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      'GET /api/outbox': () => ({ body: { data: [], pagination: { total: 0 } } }),
    });
    renderApp('/outbox');
    expect(await screen.findByRole('heading', { name: 'No mail yet' })).toBeInTheDocument();
    expect(screen.getByText(/shows only mail addressed to the account you are signed in with/)).toBeInTheDocument();
  });

  it('explains that a server with real mail has no outbox', async () => {
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      'GET /api/outbox': () => apiError(404, 'no-such-route', 'There is no GET /api/outbox.'),
    });
    renderApp('/outbox');
    expect(await screen.findByRole('heading', { name: 'No outbox on this server' })).toBeInTheDocument();
  });
});
