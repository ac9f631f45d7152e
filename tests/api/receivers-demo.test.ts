import { beforeAll, describe, expect, it } from 'vitest';
import { Membership, SetupModel, User, Workspace } from '@api/models';
import { seedDemo } from '@api/seed';
import { DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';
import { useTestApp } from './helpers/test-app';
import { clientFor, type Client } from './models-support';

const t = useTestApp();
let viewer: Client;
let workspaceId: string;

beforeAll(async () => {
  await seedDemo(t.sequelize);
  const workspace = (await Workspace.findOne({ where: { name: DEMO_WORKSPACE_NAME } }))!;
  workspaceId = workspace.id;
  const membership = (await Membership.findOne({
    where: { workspaceId, role: 'viewer' },
    include: [{ model: User, as: 'user' }],
  }))!;
  viewer = clientFor(t.app, t.config, membership.user!);
});

describe('the demo shelf', () => {
  it('has units with marks, the Kestrel fuselage unit ready in its slot and the trainer unit free', async () => {
    const units = (await viewer.get(`/api/workspaces/${workspaceId}/receivers`).expect(200)).body.data as {
      label: string;
      mark: string | null;
      status: string;
      installed: { model: { name: string }; slot: string } | null;
      readiness: { state: string } | null;
    }[];
    const byLabel = Object.fromEntries(units.map((unit) => [unit.label, unit]));
    expect(byLabel['Kestrel fuselage unit']).toMatchObject({
      mark: 'Blue tape',
      installed: { model: { name: 'Kestrel Mk II' }, slot: 'fuselage' },
      readiness: { state: 'ready' },
    });
    expect(byLabel['Meadowlark cabin unit']).toMatchObject({
      installed: { model: { name: 'Meadowlark 40' }, slot: 'cabin' },
      readiness: { state: 'ready' },
    });
    expect(byLabel['Pipit trainer unit']).toMatchObject({ mark: 'Yellow dot', status: 'free' });
    expect(units.filter((unit) => unit.mark).length).toBeGreaterThanOrEqual(3);
  });

  it('offers the trainer unit to the Kestrel’s empty wing slot with its throttle failsafe to change', async () => {
    const kestrel = (await SetupModel.findOne({ where: { workspaceId, name: 'Kestrel Mk II' } }))!;
    const units = (await viewer.get(`/api/workspaces/${workspaceId}/receivers?q=pipit`).expect(200)).body.data;
    const check = (
      await viewer.get(`/api/receivers/${units[0].id}/reuse-check?model=${kestrel.id}&slot=wing`).expect(200)
    ).body.data;
    expect(check).toMatchObject({ ready: false, holder: null });
    expect(check.changes).toContainEqual(expect.objectContaining({ pin: 3, setting: 'failsafe', from: 988 }));
    expect(check.changes).toContainEqual(expect.objectContaining({ setting: 'telemetry', from: true, to: false }));
  });

  it('keeps each installed unit’s history: put on the shelf, installed, settings applied where they differed', async () => {
    const units = (await viewer.get(`/api/workspaces/${workspaceId}/receivers?q=fuselage`).expect(200)).body.data;
    const { installs, events } = (await viewer.get(`/api/receivers/${units[0].id}/history`).expect(200)).body.data;
    expect(installs).toHaveLength(1);
    expect(events.map((event: { action: string }) => event.action)).toEqual([
      'receiver.settings-applied',
      'receiver.installed',
      'receiver.added',
    ]);
    // Installed against the revision that was the Kestrel's latest on the day, not today's.
    expect(events[1].details.revision_number).toBe(1);
  });
});
