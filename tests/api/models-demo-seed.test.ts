import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeSetup } from '@shared/analyze';
import { AuditEvent, Revision, SetupModel, Tag, Workspace } from '@api/models';
import { seedDemo } from '@api/seed';
import { DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let workspace: Workspace;

beforeAll(async () => {
  await seedDemo(t.sequelize);
  workspace = (await Workspace.findOne({ where: { name: DEMO_WORKSPACE_NAME } }))!;
});

const modelNamed = async (name: string) => (await SetupModel.findOne({ where: { workspaceId: workspace.id, name } }))!;
const historyOf = (model: SetupModel) => Revision.findAll({ where: { modelId: model.id }, order: [['number', 'ASC']] });
const tagsOf = async (model: SetupModel) =>
  Object.fromEntries(
    (await Tag.findAll({ where: { modelId: model.id }, include: [{ model: Revision, as: 'revision' }] })).map((tag) => [
      tag.name,
      tag.revision!.number,
    ]),
  );

describe('the demo models (seed step 0002)', () => {
  it("fills the demo club's hangar", async () => {
    const names = (await SetupModel.findAll({ where: { workspaceId: workspace.id } }))
      .map((model) => model.name)
      .sort();
    expect(names).toEqual(['Heron 3.6', 'Kestrel Mk II', 'Meadowlark 40', 'Sedge 3.4', 'Wren Twin']);
  });

  it('gives the scale model a dozen revisions across two seasons, with the wing receiver remap and the failsafe fix', async () => {
    const kestrel = await modelNamed('Kestrel Mk II');
    const revisions = await historyOf(kestrel);
    expect(revisions.map((revision) => revision.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(revisions[0].createdAt.getUTCFullYear()).toBe(2025);
    expect(revisions[11].createdAt.getUTCFullYear()).toBe(2026);
    expect(kestrel.updatedAt.toISOString()).toBe(revisions[11].createdAt.toISOString());

    // The first plan, one receiver for channels 1-8, is clean.
    expect(revisions[0].findings).toEqual([]);
    expect((revisions[0].document as { receivers: unknown[] }).receivers).toHaveLength(1);
    // Bound fresh, the wing receiver's pins carry channels 1-8: channels 9-16 reach no pin.
    expect(revisions[1].findings.filter((finding) => finding.rule === 'function-unrouted')).toHaveLength(8);
    // Remapped to 9-16, its pin 1 still fails safe to a throttle stop.
    expect(revisions[2].errorCount).toBe(0);
    expect(revisions[2].findings.map((finding) => `${finding.rule} ${finding.path}`)).toContain(
      'failsafe-endstop receivers[id=wing].map[pin=1].failsafe',
    );
    expect(revisions[3].findings).toEqual([]);

    expect(revisions[11]).toMatchObject({
      origin: 'revert',
      sourceRevisionId: revisions[9].id,
      contentHash: revisions[9].contentHash,
    });
    expect(await tagsOf(kestrel)).toEqual({ maiden: 6, 'season-2025': 9, 'season-2026': 12 });
  });

  it('forks the glider from a club-mate’s layout, keeping the lineage', async () => {
    const sedge = await modelNamed('Sedge 3.4');
    const heron = await modelNamed('Heron 3.6');
    const sedgeRevisions = await historyOf(sedge);
    const heronRevisions = await historyOf(heron);
    expect(heron.forkedFromRevisionId).toBe(sedgeRevisions[sedgeRevisions.length - 1].id);
    expect(heronRevisions[0]).toMatchObject({
      origin: 'fork',
      sourceRevisionId: heron.forkedFromRevisionId,
      contentHash: sedgeRevisions[1].contentHash,
    });
    expect((heronRevisions[1].document as { model: { name: string } }).model.name).toBe('Heron 3.6');
    expect(heronRevisions).toHaveLength(3);
  });

  it('seeds setups that read cleanly, each revision stored with the findings its text gives', async () => {
    const revisions = await Revision.findAll({
      include: [{ model: SetupModel, as: 'model', where: { workspaceId: workspace.id } }],
    });
    expect(revisions.length).toBe(12 + 3 + 2 + 3 + 1);
    for (const revision of revisions) {
      const analysis = analyzeSetup(revision.yamlText);
      expect(analysis.readable).toBe(true);
      expect(revision.findings).toEqual(analysis.findings);
      expect(revision.yamlText).not.toMatch(/Fenwick/);
    }
  });

  it('records the history in the audit trail with its original dates', async () => {
    const events = await AuditEvent.findAll({ where: { workspaceId: workspace.id }, order: [['createdAt', 'ASC']] });
    const meadowlark = await modelNamed('Meadowlark 40');
    const created = events.find((event) => event.action === 'model.created' && event.subjectId === meadowlark.id);
    expect(created!.createdAt.toISOString()).toBe('2024-09-14T09:00:00.000Z');
    expect(events.filter((event) => event.action === 'revision.saved')).toHaveLength(10 + 2 + 1 + 2);
    expect(events.filter((event) => event.action === 'model.forked')).toHaveLength(1);
    expect(events.filter((event) => event.action === 'revision.reverted')).toHaveLength(1);
  });
});
