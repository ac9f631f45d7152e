import { beforeAll, describe, expect, it } from 'vitest';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, saveVia, TRAINER, type Client } from './models-support';

// Accepted warnings (docs/format.md, `accepted[]`) are counted apart from the open
// ones: the counts stored with a revision, and shown in the hangar and the history,
// are the open findings only.

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
});

// Pins 2 and 4 of the trainer lose their failsafes: two failsafe-unset warnings, one of
// which (pin 4) is accepted.
const TWO_UNSET = edit(
  edit(TRAINER(), '      - { pin: 4, ch: 4, failsafe: 1500 }', '      - { pin: 4, ch: 4 }'),
  '      - { pin: 2, ch: 2, failsafe: 1500 }',
  '      - { pin: 2, ch: 2 }',
);
const accepting = (text: string) =>
  `${text}accepted:\n  - { rule: failsafe-unset, path: "receivers[id=cabin].map[pin=4]", reason: The rudder servo centres itself }\n`;

describe('stored check counts leave accepted warnings out', () => {
  it('a revision with one open and one accepted warning stores and shows one warning, in the history and the hangar', async () => {
    const created = await createModelVia(editor, roles.workspace.id, { name: 'Counted trainer', yaml: TWO_UNSET });
    expect(created.revision).toMatchObject({ warning_count: 2, error_count: 0 });

    const saved = await saveVia(editor, created.model.id, 1, accepting(TWO_UNSET), 'Accept the rudder failsafe');
    const findings = saved.findings as { rule: string; path: string; accepted?: string }[];
    expect(findings.map((finding) => [finding.path, finding.accepted ?? null])).toEqual([
      ['receivers[id=cabin].map[pin=2]', null],
      ['receivers[id=cabin].map[pin=4]', 'The rudder servo centres itself'],
    ]);

    const history = (await editor.get(`/api/models/${created.model.id}/revisions`).expect(200)).body.data as {
      number: number;
      warning_count: number;
      info_count: number;
    }[];
    expect(history.map((revision) => [revision.number, revision.warning_count])).toEqual([
      [2, 1],
      [1, 2],
    ]);

    const hangar = (await editor.get(`/api/workspaces/${roles.workspace.id}/models`).expect(200)).body.data as {
      id: string;
      latest: { number: number; warning_count: number; error_count: number };
    }[];
    expect(hangar.find((model) => model.id === created.model.id)!.latest).toMatchObject({
      number: 2,
      warning_count: 1,
      error_count: 0,
    });
  });

  it('accepting the last open warning leaves none, and a duplicate entry is itself a warning', async () => {
    const oneUnset = edit(TRAINER(), '      - { pin: 4, ch: 4, failsafe: 1500 }', '      - { pin: 4, ch: 4 }');
    const created = await createModelVia(editor, roles.workspace.id, {
      name: 'All clear trainer',
      yaml: accepting(oneUnset),
    });
    expect(created.revision).toMatchObject({ warning_count: 0, error_count: 0 });

    const twice = `${accepting(oneUnset)}  - { rule: failsafe-unset, path: "receivers[id=cabin].map[pin=4]", reason: Checked again }\n`;
    const saved = await saveVia(editor, created.model.id, 1, twice, 'Written twice');
    expect((saved.findings as { rule: string }[]).map((finding) => finding.rule)).toEqual([
      'failsafe-unset',
      'accepted-duplicate',
    ]);
    const [latest] = (await editor.get(`/api/models/${created.model.id}/revisions`).expect(200)).body.data;
    expect(latest).toMatchObject({ number: 2, warning_count: 1 });
  });
});
