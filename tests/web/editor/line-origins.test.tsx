import { act, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ProvenanceEntry } from '@shared/contract/provenance';
import { leafValues } from '@shared/lineage/leaf-paths';
import { lineOrigins } from '@web/features/editor/line-origins';
import { fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { editorView, typeOver } from './code-editor';
import { MODEL_ID, modelRoutes, revisionId } from './model-routes';
import { demoSetup, documentOf } from './setups';

// "Show where each line came from": the revision of each line beside the gutter, from
// one provenance answer for the revision the edit stands on.

const revision = {
  id: revisionId(7),
  number: 7,
  yaml: demoSetup,
  document: documentOf(demoSetup),
  message: 'Lights on 10 and 11',
};

const TAILWHEEL_FAILSAFE = 'receivers[id=wing].map[pin=1].failsafe';

// Every setting from revision 3 but the wing's pin 1 failsafe, changed in revision 6.
function provenanceAnswer(): ProvenanceEntry[] {
  return [...leafValues(revision.document).keys()].map((path) =>
    path === TAILWHEEL_FAILSAFE
      ? entry(path, 6, 'Tailwheel centres on signal loss', '2025-02-16T10:00:00.000Z')
      : entry(path, 3, 'Second receiver in the wing', '2025-01-05T10:00:00.000Z'),
  );
}

function entry(path: string, number: number, message: string, created_at: string): ProvenanceEntry {
  return {
    path,
    revision: { id: revisionId(number), number, model_id: MODEL_ID },
    author: { id: 'u1', name: 'Ines Marchbank' },
    created_at,
    message,
    inherited: false,
  };
}

const lineOf = (text: string, needle: string) => text.slice(0, text.indexOf(needle)).split('\n').length;

describe('lineOrigins', () => {
  it('names the newest change among a line’s settings, and nothing for a line whose value is not saved', () => {
    const provenance = new Map(provenanceAnswer().map((item) => [item.path, item]));
    const pin1 = lineOf(demoSetup, '{ pin: 1, ch: 9,  failsafe: 1500 }');
    const origins = lineOrigins(demoSetup, revision.document, provenance);
    expect(origins.find((origin) => origin.line === pin1)).toEqual({
      line: pin1,
      label: 'r6',
      title: 'since r6, Ines Marchbank, 16 Feb 2025: ‘Tailwheel centres on signal loss’',
    });
    const edited = demoSetup.replace('{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 1450 }');
    // pin and ch are still as saved (r3); the failsafe is not, so the newest saved value speaks.
    expect(lineOrigins(edited, revision.document, provenance).find((origin) => origin.line === pin1)?.label).toBe('r3');
  });
});

describe('Edit: where each line came from', () => {
  it('asks once for the provenance when the pilot turns it on, and marks the lines beside the gutter', async () => {
    const server = fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...modelRoutes([revision]),
      [`GET /api/models/${MODEL_ID}/provenance`]: () => ({ body: { data: provenanceAnswer() } }),
    });
    renderApp(`/models/${MODEL_ID}/edit`);
    await screen.findByRole('complementary', { name: 'Checks' });
    await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());
    expect(server.called('GET', `/api/models/${MODEL_ID}/provenance`)).toHaveLength(0);

    await userEvent.click(screen.getByRole('checkbox', { name: 'Show where each line came from' }));
    await waitFor(() => expect(document.querySelector('.cm-origin-mark')).not.toBeNull());
    const first = document.querySelector<HTMLElement>('.cm-origin-mark')!;
    expect(first.textContent).toBe('r3');
    expect(first.title).toBe('since r3, Ines Marchbank, 5 Jan 2025: ‘Second receiver in the wing’');
    const asked = server.called('GET', `/api/models/${MODEL_ID}/provenance`);
    expect(asked).toHaveLength(1);
    expect(asked[0].url.searchParams.get('revision')).toBe(revision.id);

    // An edited line shows nothing until it is saved; the others keep their marks.
    const count = () => document.querySelectorAll('.cm-origin-mark').length;
    const before = count();
    typeOver('format: bindery-setup/1', 'format: bindery-setup/9');
    expect(await screen.findByText('(lines you changed show nothing until saved)')).toBeInTheDocument();
    await waitFor(() => expect(count()).toBe(before - 1));
    expect(document.querySelector('.cm-origin-mark')!.textContent).toBe('r3');
    expect(server.called('GET', `/api/models/${MODEL_ID}/provenance`)).toHaveLength(1);
  });

  it('says the mark of the cursor’s line in a polite status line under the editor, for keyboard users', async () => {
    // The edit of the test before is this tab's draft; this one starts from the saved text.
    sessionStorage.clear();
    fakeServer({
      ...sessionRoutes({ signedIn: true }).routes,
      ...modelRoutes([revision]),
      [`GET /api/models/${MODEL_ID}/provenance`]: () => ({ body: { data: provenanceAnswer() } }),
    });
    renderApp(`/models/${MODEL_ID}/edit`);
    await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());
    const status = screen.getAllByRole('status').find((element) => element.getAttribute('aria-live') === 'polite')!;
    expect(status).toHaveTextContent('');

    await userEvent.click(screen.getByRole('checkbox', { name: 'Show where each line came from' }));
    await waitFor(() => expect(document.querySelector('.cm-origin-mark')).not.toBeNull());
    const moveTo = (needle: string) => {
      const view = editorView();
      act(() => view.dispatch({ selection: { anchor: view.state.doc.toString().indexOf(needle) } }));
    };
    const pin1 = lineOf(demoSetup, '{ pin: 1, ch: 9,  failsafe: 1500 }');
    moveTo('{ pin: 1, ch: 9,  failsafe: 1500 }');
    expect(status).toHaveTextContent(
      `Line ${pin1}: since r6, Ines Marchbank, 16 Feb 2025: ‘Tailwheel centres on signal loss’`,
    );
    // A comment line holds no setting; an edited line no saved one.
    moveTo('# ');
    expect(status).toHaveTextContent(/^Line 1: no saved setting on this line$/);
    moveTo('format: bindery-setup/1');
    expect(status).toHaveTextContent(/^Line \d+: since r3, Ines Marchbank, 5 Jan 2025: ‘Second receiver in the wing’$/);
    typeOver('format: bindery-setup/1', 'format: bindery-setup/9');
    expect(status).toHaveTextContent(/^Line \d+: no saved setting on this line$/);
  });
});
