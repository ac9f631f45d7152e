import { randomUUID } from 'node:crypto';
// pdf-parse's package entry runs a self-test when loaded without a parent module; its library file does not.
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import request from 'supertest';
import { parse } from 'yaml';
import { beforeAll, describe, expect, it } from 'vitest';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, fixture, saveVia, SCALE, type Client } from './models-support';

const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let viewer: Client;
let kestrel: { modelId: string; revisionId: string };

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  viewer = clientFor(t.app, t.config, roles.members.viewer);
  const created = await createModelVia(editor, roles.workspace.id, {
    name: 'Kestrel Mk II / "scale" #2',
    yaml: SCALE(),
  });
  kestrel = { modelId: created.model.id, revisionId: created.revision.id };
  const wing = (
    await editor
      .post(`/api/workspaces/${roles.workspace.id}/receivers`, parse(fixture('reuse/wing-unit.yaml')))
      .expect(201)
  ).body.data;
  await editor.post(`/api/receivers/${wing.id}/install`, { model: kestrel.modelId, slot: 'wing' }).expect(201);
});

const binary = (test: request.Test) =>
  test.buffer(true).parse((res, callback) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => callback(null, Buffer.concat(chunks)));
  });

async function sheetText(
  revisionId: string,
): Promise<{ text: string; pages: number; headers: Record<string, string> }> {
  const response = await binary(viewer.get(`/api/revisions/${revisionId}/field-sheet.pdf`)).expect(200);
  const pdf = await pdfParse(response.body as Buffer);
  return { text: pdf.text, pages: pdf.numpages, headers: response.headers };
}

// pdf-parse joins the pieces of one printed line without spaces.
const row = (...cells: (string | number)[]) =>
  new RegExp(cells.map((cell) => String(cell).replace(/[.*+?^${}()|[\]\\]/g, '\\$&')).join('\\s*'));

describe('GET /api/revisions/:id/field-sheet.pdf', () => {
  it('is one A4 page for the two-receiver model, named safely, for any reader of the workspace', async () => {
    const { pages, headers } = await sheetText(kestrel.revisionId);
    expect(pages).toBe(1);
    expect(headers['content-type']).toBe('application/pdf');
    expect(headers['content-disposition']).toBe('attachment; filename=kestrel-mk-ii-scale-2-r1-field-sheet.pdf');
  });

  it('holds each receiver’s pin -> channel -> function -> failsafe table', async () => {
    const { text } = await sheetText(kestrel.revisionId);
    // Fuselage pins 1-8 carry channels 1-8; wing pins 1-8 carry 9-16 (fixtures/valid/scale-16-channel-two-receivers.yaml).
    expect(text).toMatch(row(1, 1, 'aileron-left', '1500 µs'));
    expect(text).toMatch(row(3, 3, 'motor', '1000 µs'));
    expect(text).toMatch(row(5, 5, 'gear', 'hold'));
    expect(text).toMatch(row(1, 9, 'tailwheel', '1500 µs'));
    expect(text).toMatch(row(3, 11, 'landing-light', 'hold'));
    expect(text).toMatch(row(8, 16, 'pilot-head', '1500 µs'));
    expect(text).toContain('Fuselage receiver (blue tape) · slot fuselage');
    expect(text).toContain('primary, 8 outputs, telemetry: sends');
    // What each pin does when its receiver loses the link (evaluation rule 9): its pulse, or held.
    expect(text).toMatch(row(3, 3, 'motor', '1000 µs', '1000 µs'));
    expect(text).toMatch(row(5, 5, 'gear', 'hold', 'held'));
    expect(text).toMatch(row(3, 11, 'landing-light', 'hold', 'held'));
    expect(text).toContain('secondary, 8 outputs, telemetry: silent (off)');
  });

  it('names the model, revision, short hash, review state, link and the unit installed in each slot', async () => {
    const { text } = await sheetText(kestrel.revisionId);
    const hash = (await editor.get(`/api/revisions/${kestrel.revisionId}`).expect(200)).body.data
      .content_hash as string;
    expect(text).toContain('Kestrel Mk II / "scale" #2');
    expect(text).toMatch(row('Revision', 1));
    expect(text).toContain(hash.slice(0, 12));
    expect(text).toContain('Not reviewed');
    expect(text).toContain('16 channels at 150 Hz');
    expect(text).toMatch(row('Unit: Kestrel wing unit', 'mark: Red tape'));
    expect(text).toContain('Unit: none on the shelf is installed here');
    // The unit line says a bind can clear what the unit stores.
    expect(text).toContain('Re-binding can clear the unit’s stored settings');
    // The cut in full: its switch, position and value.
    expect(text).toContain('Cut on ch 3 (motor): Arm (guarded) (motor-arm) at position 0 holds it at -100 %.');
    expect(text).toMatch(row(14, 'canopy', 'aux'));
  });

  it('carries the cautions, the same as the panel on screen', async () => {
    const { text } = await sheetText(kestrel.revisionId);
    const sheet = (await viewer.get(`/api/revisions/${kestrel.revisionId}/field-sheet`).expect(200)).body.data;
    const flat = text.replace(/\s+/g, ' ');
    for (const item of sheet.cautions.items as { title: string; body: string }[]) {
      expect(flat).toContain(item.title);
      expect(flat).toContain(item.body);
    }
    // [back-feed], [cap-658] 7 kg, [turbine-failsafe] two seconds (from memory, deferring to the code of practice), and the disclaimer.
    expect(flat).toContain('back-feed');
    expect(flat).toContain('7 kg');
    expect(flat).toContain('two seconds');
    expect(flat).toContain('not a certification');
  });

  it('lists the findings to settle when the revision has some', async () => {
    const leftover = edit(SCALE(), '{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 1000 }');
    const saved = await saveVia(editor, kestrel.modelId, 1, leftover, 'Tailwheel pin keeps a throttle failsafe');
    const { text } = await sheetText(saved.id);
    expect(text.replace(/\s+/g, ' ')).toMatch(/Warning \(failsafe-endstop\)/);
  });

  it('is 404 outside the workspace, 401 without a session, 422 for a revision with no valid setup', async () => {
    const outsider = clientFor(t.app, t.config, roles.outsider);
    expect(
      (await outsider.get(`/api/revisions/${kestrel.revisionId}/field-sheet.pdf`).expect(404)).body.error.code,
    ).toBe('revision-not-found');
    await outsider.get(`/api/revisions/${randomUUID()}/field-sheet`).expect(404);
    await request(t.app).get(`/api/revisions/${kestrel.revisionId}/field-sheet.pdf`).expect(401);
    const broken = await createModelVia(editor, roles.workspace.id, {
      name: 'Half written',
      yaml: 'format: bindery-setup/1\nmodel: { name: Half }\n',
    });
    const refused = await viewer.get(`/api/revisions/${broken.revision.id}/field-sheet.pdf`).expect(422);
    expect(refused.body.error.code).toBe('setup-not-valid');
  });
});

describe('GET /api/revisions/:id/field-sheet', () => {
  it('answers what the sheet prints, for the screen', async () => {
    const { data } = (await viewer.get(`/api/revisions/${kestrel.revisionId}/field-sheet`).expect(200)).body;
    expect(data).toMatchObject({
      model: { id: kestrel.modelId, setup_name: 'Kestrel Mk II' },
      revision: { id: kestrel.revisionId, number: 1, short_hash: expect.stringMatching(/^[0-9a-f]{12}$/) },
      review_state: 'none',
      link: { channels: 16, packet_rate_hz: 150 },
      counts: { errors: 0, warnings: 0 },
    });
    expect(data.channels).toHaveLength(16);
    expect(
      data.receivers.map((receiver: { id: string; unit: { label: string } | null }) => [
        receiver.id,
        receiver.unit?.label ?? null,
      ]),
    ).toEqual([
      ['fuselage', null],
      ['wing', 'Kestrel wing unit'],
    ]);
    expect(data.receivers[1].pins[2]).toEqual({
      pin: 3,
      ch: 11,
      function: 'landing-light',
      role: 'light',
      failsafe: 'hold',
      link_loss: { kind: 'held', pulse_us: null, words: 'held' },
    });
    expect(data.receivers[0].pins[2].link_loss).toEqual({ kind: 'pulse', pulse_us: 1000, words: '1000 µs' });
    expect(data.channels[2].cut).toEqual({
      control: 'motor-arm',
      control_label: 'Arm (guarded)',
      position: 0,
      value: -100,
      words: 'Arm (guarded) (motor-arm) at position 0 holds it at -100 %',
    });
    expect(data.channels[0].cut).toBeNull();
    expect(data.cautions.items.length).toBeGreaterThanOrEqual(5);
  });
});
