import { forEachDiagnostic } from '@codemirror/lint';
import { screen, waitFor, within } from '@testing-library/react';
import { DEFAULT_CLUB_RULES, type RuleSeverity } from '@shared/rules/club-rules';
import { CLUB, fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { editorView, typeOver } from './code-editor';
import { MODEL_ID, modelRoutes, revisionId } from './model-routes';
import { demoSetup, documentOf } from './setups';

const revision = {
  id: revisionId(7),
  number: 7,
  yaml: demoSetup,
  document: documentOf(demoSetup),
  message: 'Lights on 10 and 11',
};

async function openEditor(path = `/models/${MODEL_ID}/edit`, severities: Record<string, RuleSeverity> = {}) {
  fakeServer({
    ...sessionRoutes({ signedIn: true }).routes,
    ...modelRoutes([revision]),
    [`GET /api/workspaces/${CLUB}/rules`]: () => ({
      body: { data: { ...DEFAULT_CLUB_RULES, severities, defaults: {}, updated_at: null, history: [] } },
    }),
  });
  const app = renderApp(path);
  const checks = await screen.findByRole('complementary', { name: 'Checks' });
  await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());
  return { ...app, checks };
}

// CodeMirror in jsdom and the checks on every pause make these slower than most.
const SLOW = { timeout: 20_000 };

// A draft outlives the screen in sessionStorage, as it should; each test starts without one.
beforeEach(() => sessionStorage.clear());

describe('Edit: live findings', () => {
  it(
    'shows a channel-shared finding while two plan entries share a channel, and drops it once fixed',
    SLOW,
    async () => {
      const { checks } = await openEditor();
      expect(within(checks).getByText('The setup passes every check.')).toBeInTheDocument();

      typeOver('ch: 9,  function: tailwheel', 'ch: 1,  function: tailwheel');
      const rule = await within(checks).findByText('channel-shared');
      const item = rule.closest('li')!;
      expect(within(item).getByText('Error')).toBeInTheDocument();
      expect(item).toHaveTextContent('line 41:7');
      expect(within(checks).getByText('1 error')).toBeInTheDocument();

      typeOver('ch: 1,  function: tailwheel', 'ch: 9,  function: tailwheel');
      await waitFor(() => expect(within(checks).queryByText('channel-shared')).not.toBeInTheDocument());
      expect(within(checks).getByText('The setup passes every check.')).toBeInTheDocument();
    },
  );

  it('ranks the live findings by the club’s rules: a check raised to an error says so', SLOW, async () => {
    const { checks } = await openEditor(undefined, { 'failsafe-unset': 'error' });
    // Pin 1 of the wing without its failsafe: a failsafe-unset warning by the format, an error by this club.
    typeOver('{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9 }');
    const rule = await within(checks).findByText('failsafe-unset');
    const item = rule.closest('li')!;
    expect(within(item).getByText('Error')).toBeInTheDocument();
    expect(item).toHaveTextContent('club rule: warning raised to error');
    expect(within(checks).getByText('1 error')).toBeInTheDocument();
  });

  it('leaves out the findings of a check the club switched off', SLOW, async () => {
    const { checks } = await openEditor(undefined, { 'failsafe-unset': 'off' });
    typeOver('{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9 }');
    // A second slip the club did not switch off shows the checks have run on the new text.
    typeOver('ch: 9,  function: tailwheel', 'ch: 1,  function: tailwheel');
    await within(checks).findByText('channel-shared');
    expect(within(checks).queryByText('failsafe-unset')).not.toBeInTheDocument();
  });

  it('marks findings in the editor itself: a gutter mark and an underline on the node', SLOW, async () => {
    const { checks } = await openEditor();
    typeOver('format: bindery-setup/1', 'format: bindery-setup/9');
    await within(checks).findByText('schema');

    await waitFor(() => expect(document.querySelector('.cm-lintRange-error')).not.toBeNull());
    expect(document.querySelector('.cm-lintRange-error')?.textContent).toBe('format: bindery-setup/9');
    expect(document.querySelector('.cm-lint-marker-error')).not.toBeNull();

    // Further down, past what jsdom draws, the editor state carries the marks all the same.
    typeOver('format: bindery-setup/9', 'format: bindery-setup/1');
    typeOver('failsafe: 1000 }', 'failsafe: hold }');
    await within(checks).findByText('failsafe-throttle');
    await waitFor(() => {
      const marked: string[] = [];
      const { state } = editorView();
      forEachDiagnostic(state, (diagnostic, from, to) =>
        marked.push(`${diagnostic.source} ${state.sliceDoc(from, to)}`),
      );
      expect(marked).toContain('failsafe-throttle failsafe: hold');
    });
  });

  it(
    'puts the cursor at the start of the line that ?line= names, without selecting it, and tidies the address',
    SLOW,
    async () => {
      const { router } = await openEditor(`/models/${MODEL_ID}/edit?line=14`);
      await waitFor(() => {
        const { state } = editorView();
        const line = state.doc.line(14);
        expect(state.selection.main.empty).toBe(true);
        expect(state.selection.main.head).toBe(line.from);
      });
      expect(editorView().state.doc.line(14).text).toBe('  channels: 16');
      // The jump is taken once: the address goes back to the editor's own.
      await waitFor(() => expect(router.state.location.search).toBe(''));
      expect(router.state.location.pathname).toBe(`/models/${MODEL_ID}/edit`);
    },
  );
});
