import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { diffSetups } from '@shared/diff/diff-setups';
import { apiError, fakeServer, sessionRoutes, type FakeHandler } from '../fake-server';
import { renderApp } from '../render-app';
import { editorView, typeOver } from './code-editor';
import { MODEL_ID, modelRoutes, revisionId, revisionRoutes, revisionView, type StoredRevision } from './model-routes';
import { demoSetup, documentOf } from './setups';

const SLOW = { timeout: 20_000 };

beforeEach(() => sessionStorage.clear());

const stored = (number: number, yaml: string, message: string): StoredRevision => ({
  id: revisionId(number),
  number,
  yaml,
  document: documentOf(yaml),
  message,
});

const r7 = stored(7, demoSetup, 'Lights on 10 and 11');
// Saved by a club mate while the pilot was editing revision 7.
const r8Text = demoSetup.replace(
  '      - { pin: 7, ch: 15, failsafe: 1500 }',
  '      - { pin: 7, ch: 15, failsafe: 1100 }',
);
const r8 = stored(8, r8Text, 'Cowl flaps close on failsafe');

const saveRoute =
  (revisions: StoredRevision[]): FakeHandler =>
  (request) => {
    const body = request.body as { base: number; message: string; yaml: string };
    const latest = revisions[revisions.length - 1];
    if (body.base !== latest.number) {
      return apiError(
        409,
        'stale-base',
        `Revision ${body.base} is not the latest: revision ${latest.number} was saved meanwhile.`,
        {
          base: body.base,
          latest: latest.number,
          latest_id: latest.id,
        },
      );
    }
    const saved = stored(latest.number + 1, body.yaml, body.message);
    revisions.push(saved);
    const { yaml: _yaml, document: _document, ...summary } = revisionView(saved);
    return { status: 201, body: { data: summary } };
  };

/** The editor on the last of `revisions`; `later` can be fetched once a test adds them. */
async function openEditor(revisions: StoredRevision[], later: StoredRevision[] = []) {
  const server = fakeServer({
    ...sessionRoutes({ signedIn: true }).routes,
    ...modelRoutes(revisions),
    ...revisionRoutes(later),
    [`POST /api/models/${MODEL_ID}/revisions`]: saveRoute(revisions),
  });
  const app = renderApp(`/models/${MODEL_ID}/edit`);
  await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());
  return { ...app, server };
}

describe('Edit: saving', () => {
  it('asks for a message and saves on the revision the edit started from', SLOW, async () => {
    const revisions = [r7];
    const { user, server } = await openEditor(revisions);
    expect(screen.getByRole('button', { name: 'Save revision…' })).toBeDisabled();

    typeOver('weight: 80 }', 'weight: 70 }');
    await waitFor(() => expect(screen.getByRole('button', { name: 'Save revision…' })).toBeEnabled());
    await user.click(screen.getByRole('button', { name: 'Save revision…' }));

    const dialog = screen.getByRole('dialog', { name: 'Save as revision 8' });
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));
    expect(
      within(dialog).getByText('Say in a few words what this revision changes, for whoever reads the history.'),
    ).toBeInTheDocument();
    expect(server.called('POST', `/api/models/${MODEL_ID}/revisions`)).toHaveLength(0);

    await user.type(within(dialog).getByLabelText('What changed'), 'Less tailwheel throw');
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));

    expect(await screen.findByText('Saved revision 8')).toBeInTheDocument();
    const [request] = server.called('POST', `/api/models/${MODEL_ID}/revisions`);
    expect(request.body).toEqual({
      base: 7,
      message: 'Less tailwheel throw',
      yaml: demoSetup.replace('weight: 80 }', 'weight: 70 }'),
    });
    expect(screen.queryByRole('dialog')).not.toBeInTheDocument();
    expect(screen.getByText('Editing from revision 8')).toBeInTheDocument();
    expect(screen.getByText('No unsaved changes')).toBeInTheDocument();
    expect(sessionStorage.length).toBe(0);
  });

  it(
    'shows what changed meanwhile when the base is stale, and saves again on the latest only when asked',
    SLOW,
    async () => {
      // The pilot opened revision 7; revision 8 lands before they save.
      const revisions = [r7];
      const { user, server } = await openEditor(revisions, [r8]);
      revisions.push(r8);

      typeOver('weight: 80 }', 'weight: 70 }');
      await waitFor(() => expect(screen.getByRole('button', { name: 'Save revision…' })).toBeEnabled());
      await user.click(screen.getByRole('button', { name: 'Save revision…' }));
      await user.type(screen.getByLabelText('What changed'), 'Less tailwheel throw');
      await user.click(screen.getByRole('button', { name: 'Save revision' }));

      const panel = await screen.findByRole('alert', {
        name: /Not saved: revision 8 was saved while you were editing/,
      });
      expect(panel).toHaveTextContent('Your edit started from revision 7; the latest is revision 8');
      const meanwhile = diffSetups(r7.document, r8.document).changes;
      expect(meanwhile).toHaveLength(1);
      expect(await within(panel).findByText(meanwhile[0].summary)).toBeInTheDocument();
      // Saving the pilot's text as it is would undo the club mate's failsafe and make their own change.
      const mine = diffSetups(r8.document, documentOf(demoSetup.replace('weight: 80 }', 'weight: 70 }'))).changes.map(
        (change) => change.summary,
      );
      expect(mine).toHaveLength(2);
      for (const sentence of mine) expect(within(panel).getByText(sentence)).toBeInTheDocument();
      expect(editorView().state.doc.toString()).toContain('weight: 70 }');
      expect(server.called('POST', `/api/models/${MODEL_ID}/revisions`)).toHaveLength(1);

      await user.click(within(panel).getByRole('button', { name: 'Load revision 8 and re-apply my text' }));
      expect(screen.queryByRole('alert', { name: /Not saved/ })).not.toBeInTheDocument();
      expect(screen.getByText('Editing from revision 8')).toBeInTheDocument();

      await user.click(screen.getByRole('button', { name: 'Save revision…' }));
      await user.type(screen.getByLabelText('What changed'), 'Less tailwheel throw');
      await user.click(screen.getByRole('button', { name: 'Save revision' }));
      expect(await screen.findByText('Saved revision 9')).toBeInTheDocument();
      const saves = server.called('POST', `/api/models/${MODEL_ID}/revisions`);
      expect(saves.map((request) => (request.body as { base: number }).base)).toEqual([7, 8]);
    },
  );

  it('can start over from the latest revision instead, dropping the edit', SLOW, async () => {
    const revisions = [r7];
    const { user } = await openEditor(revisions, [r8]);
    revisions.push(r8);
    typeOver('weight: 80 }', 'weight: 70 }');
    await waitFor(() => expect(screen.getByRole('button', { name: 'Save revision…' })).toBeEnabled());
    await user.click(screen.getByRole('button', { name: 'Save revision…' }));
    await user.type(screen.getByLabelText('What changed'), 'Less tailwheel throw');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));

    const panel = await screen.findByRole('alert', { name: /Not saved/ });
    await user.click(await within(panel).findByRole('button', { name: 'Discard my edit, open revision 8' }));
    await waitFor(() => expect(editorView().state.doc.toString()).toBe(r8Text));
    expect(screen.getByText('No unsaved changes')).toBeInTheDocument();
  });
});

describe('Edit: who may change the setup', () => {
  it('shows a viewer the setup read-only, with no way to save', SLOW, async () => {
    fakeServer({
      ...sessionRoutes({
        signedIn: true,
        workspaces: [{ id: '5f0c2e7a-4d4c-4591-9e2d-8a3b5c7e0117', name: 'Hollowfield Aero Club', role: 'viewer' }],
      }).routes,
      ...modelRoutes([r7], { role: 'viewer' }),
    });
    renderApp(`/models/${MODEL_ID}/edit`);
    await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());

    expect(screen.getByText(/you can read and download this setup, but not change it/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save revision…' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Open a file…' })).not.toBeInTheDocument();
    expect(editorView().state.readOnly).toBe(true);
    expect(document.querySelector('.cm-content')).toHaveAttribute('contenteditable', 'false');
  });
});

describe('Edit: unsaved changes', () => {
  it('asks before leaving the editor with unsaved changes', SLOW, async () => {
    const { user, router } = await openEditor([r7]);
    typeOver('weight: 80 }', 'weight: 70 }');
    await waitFor(() => expect(screen.getByText('Unsaved changes')).toBeInTheDocument());

    await user.click(screen.getByRole('link', { name: 'Hangar' }));
    const dialog = await screen.findByRole('dialog', { name: 'Leave with unsaved changes?' });
    await user.click(within(dialog).getByRole('button', { name: 'Stay and keep editing' }));
    expect(router.state.location.pathname).toBe(`/models/${MODEL_ID}/edit`);
    expect(editorView().state.doc.toString()).toContain('weight: 70 }');

    await user.click(screen.getByRole('link', { name: 'Overview' }));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Leave' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/models/${MODEL_ID}/overview`));

    // Back in the editor the edit is still there, and leaving again still asks.
    await user.click(screen.getByRole('link', { name: 'Edit' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/models/${MODEL_ID}/edit`));
    await waitFor(() => expect(editorView().state.doc.toString()).toContain('weight: 70 }'));
    await user.click(screen.getByRole('link', { name: 'History' }));
    expect(await screen.findByRole('dialog', { name: 'Leave with unsaved changes?' })).toBeInTheDocument();
  });

  it('keeps the edit as a draft in the tab, brought back when the editor opens again', SLOW, async () => {
    await openEditor([r7]);
    typeOver('weight: 80 }', 'weight: 70 }');
    await waitFor(() => expect(screen.getByText('Unsaved changes')).toBeInTheDocument());
    // As after a reload: the page goes, the tab's sessionStorage stays.
    cleanup();

    await openEditor([r7]);
    expect(await screen.findByText(/Your unsaved changes from earlier in this tab are back/)).toBeInTheDocument();
    await waitFor(() =>
      expect(editorView().state.doc.toString()).toBe(demoSetup.replace('weight: 80 }', 'weight: 70 }')),
    );
    expect(screen.getByText('Editing from revision 7')).toBeInTheDocument();
  });
});
