import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, sessionRoutes } from '../fake-server';
import { renderApp } from '../render-app';
import { editorView } from './code-editor';
import { MODEL_ID, modelRoutes, revisionId } from './model-routes';
import { demoSetup, documentOf } from './setups';

const SLOW = { timeout: 20_000 };

beforeEach(() => sessionStorage.clear());

async function openEditor() {
  const revision = {
    id: revisionId(7),
    number: 7,
    yaml: demoSetup,
    document: documentOf(demoSetup),
    message: 'Lights on 10 and 11',
  };
  fakeServer({ ...sessionRoutes({ signedIn: true }).routes, ...modelRoutes([revision]) });
  const app = renderApp(`/models/${MODEL_ID}/edit`);
  await waitFor(() => expect(document.querySelector('.cm-editor')).not.toBeNull());
  return app;
}

const text = () => editorView().state.doc.toString();

describe('Edit: the channel plan and mix forms', () => {
  it('edits the channel plan in place and adds a channel on the first free number', SLOW, async () => {
    const { user } = await openEditor();
    await user.click(screen.getByRole('tab', { name: 'Channel plan' }));
    const plan = screen.getByRole('group', { name: 'Channel plan' });

    await user.selectOptions(within(plan).getByLabelText('Role, row 14'), 'payload');
    await waitFor(() => expect(text()).toContain('  - { ch: 14, function: canopy,        role: payload }\n'));

    const fn = within(plan).getByLabelText('Function, row 14');
    await user.clear(fn);
    await user.type(fn, 'Canopy!{Enter}');
    expect(within(plan).getByText('Lower-case letters, digits and dashes, like flap-left.')).toBeInTheDocument();
    await user.clear(fn);
    await user.type(fn, 'canopy-release{Enter}');
    await waitFor(() => expect(text()).toContain('  - { ch: 14, function: canopy-release,        role: payload }\n'));

    await user.click(within(plan).getByRole('button', { name: 'Add a channel' }));
    await waitFor(() =>
      expect(text()).toContain(
        '  - { ch: 16, function: pilot-head,    role: aux }\n  - { ch: 17, function: channel-17, role: aux }\nmixes:',
      ),
    );
    // Channel 17 is past the link's 16 and carried by no pin: the checks say so at once.
    const checks = screen.getByRole('complementary', { name: 'Checks' });
    expect(await within(checks).findByText('channel-beyond-link')).toBeInTheDocument();
    expect(within(checks).getByText('function-unrouted')).toBeInTheDocument();
  });

  it('gives a mix rates on a switch, one weight per position, and changes a weight', SLOW, async () => {
    const { user } = await openEditor();
    await user.click(screen.getByRole('tab', { name: 'Mixes' }));
    const mixes = screen.getByRole('group', { name: 'Mixes' });

    await user.selectOptions(within(mixes).getByLabelText('Rates switch of mix elevator'), 'rate-switch');
    await waitFor(() =>
      expect(text()).toContain(
        '  - { id: elevator,   from: elevator-stick, to: 2, weight: 92, expo: 15, rates: { control: rate-switch, weights: [92, 92] } }\n',
      ),
    );

    const low = within(mixes).getByLabelText('Rate weight of mix elevator at position 1');
    await user.clear(low);
    await user.type(low, '70{Enter}');
    await waitFor(() => expect(text()).toContain('rates: { control: rate-switch, weights: [92, 70] } }'));

    await user.selectOptions(within(mixes).getByLabelText('Rates switch of mix elevator'), 'no rates');
    await waitFor(() =>
      expect(text()).toContain('  - { id: elevator,   from: elevator-stick, to: 2, weight: 92, expo: 15 }\n'),
    );
    expect(text()).toBe(demoSetup);
  });
});

describe('Edit: opening a file', () => {
  it('puts a .yaml file into the editor as an unsaved change', SLOW, async () => {
    const { user } = await openEditor();
    const input = document.querySelector<HTMLInputElement>('input[type=file]')!;
    const edited = demoSetup.replace('weight: 80 }', 'weight: 75 }');
    await user.upload(input, new File([edited], 'kestrel-field.yaml', { type: 'application/yaml' }));

    expect(await screen.findByText('Opened kestrel-field.yaml in the editor')).toBeInTheDocument();
    await waitFor(() => expect(text()).toBe(edited));
    expect(screen.getByText('Unsaved changes')).toBeInTheDocument();
  });

  it('refuses a file that is not YAML and leaves the text alone', SLOW, async () => {
    await openEditor();
    // A browser's file picker can be told to show every file; the editor still checks.
    const user = userEvent.setup({ applyAccept: false });
    const input = document.querySelector<HTMLInputElement>('input[type=file]')!;
    await user.upload(input, new File(['not a setup'], 'notes.txt', { type: 'text/plain' }));

    expect(await screen.findByText('notes.txt was not opened')).toBeInTheDocument();
    expect(text()).toBe(demoSetup);
  });
});
