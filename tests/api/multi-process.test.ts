import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision } from '@api/models';
import { createRoleFixture, tokenFor, type RoleFixture } from './helpers/factories';
import { startApiProcess, type ApiProcess } from './helpers/api-processes';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, TRAINER } from './models-support';

// Two real API processes on one database, as `npm start` runs its workers: nothing a
// save relies on may live in one process's memory.
const t = useTestApp();
let roles: RoleFixture;
let processes: ApiProcess[] = [];

beforeAll(async () => {
  roles = await createRoleFixture();
  processes = await Promise.all([
    startApiProcess(t.database.url, t.config.jwtSecret),
    startApiProcess(t.database.url, t.config.jwtSecret),
  ]);
}, 60_000);

afterAll(async () => {
  await Promise.all(processes.map((child) => child.stop()));
});

function saveOn(api: ApiProcess, token: string, modelId: string, body: object): Promise<Response> {
  return fetch(`${api.url}/api/models/${modelId}/revisions`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
  });
}

describe('two API processes on one database', () => {
  it('are two processes', () => {
    expect(new Set(processes.map((child) => child.pid)).size).toBe(2);
    expect(processes.map((child) => child.pid)).not.toContain(process.pid);
  });

  it('a ten-way save race split across both answers exactly one 201 and nine 409', async () => {
    const editor = clientFor(t.app, t.config, roles.members.editor);
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Two-process race', yaml: TRAINER() });
    const token = tokenFor(roles.members.editor, t.config);
    const texts = Array.from({ length: 10 }, (_, index) => edit(TRAINER(), 'expo: 30,', `expo: ${40 + index},`));
    const responses = await Promise.all(
      texts.map((yaml, index) =>
        saveOn(processes[index % 2], token, model.id, { base: 1, message: `racer ${index}`, yaml }),
      ),
    );
    const bodies = await Promise.all(responses.map((response) => response.json()));
    expect(responses.map((response) => response.status).sort()).toEqual([
      201, 409, 409, 409, 409, 409, 409, 409, 409, 409,
    ]);
    for (const [index, response] of responses.entries())
      if (response.status === 409) expect(bodies[index].error).toMatchObject({ code: 'stale-base' });
    const stored = await Revision.findAll({ where: { modelId: model.id }, order: [['number', 'ASC']] });
    expect(stored.map((revision) => revision.number)).toEqual([1, 2]);
    const winner = bodies[responses.findIndex((response) => response.status === 201)].data;
    expect(stored[1].id).toBe(winner.id);
  });

  it('saves retried on the latest base across both processes: every acknowledged save is stored, gapless', async () => {
    const editor = clientFor(t.app, t.config, roles.members.editor);
    const { model } = await createModelVia(editor, roles.workspace.id, { name: 'Two-process queue', yaml: TRAINER() });
    const token = tokenFor(roles.members.editor, t.config);
    const acknowledged: { id: string; number: number; yaml: string }[] = [];
    await Promise.all(
      Array.from({ length: 10 }, async (_, index) => {
        const yaml = edit(TRAINER(), 'expo: 30,', `expo: ${50 + index},`);
        for (let base = 1, attempt = 0; attempt < 50; attempt++) {
          const response = await saveOn(processes[(index + attempt) % 2], token, model.id, { base, yaml });
          const body = await response.json();
          if (response.status === 201) return acknowledged.push({ id: body.data.id, number: body.data.number, yaml });
          expect(response.status).toBe(409);
          base = body.error.details.latest;
        }
        throw new Error(`save ${index} never landed`);
      }),
    );
    const stored = await Revision.findAll({ where: { modelId: model.id }, order: [['number', 'ASC']] });
    expect(stored.map((revision) => revision.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
    for (const save of acknowledged) {
      const row = stored.find((revision) => revision.id === save.id);
      expect(row?.number).toBe(save.number);
      expect(row?.yamlText).toBe(save.yaml);
    }
  });
});
