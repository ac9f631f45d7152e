import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Transaction } from 'sequelize';
import { createModel } from '../../commands/create-model';
import { forkModel } from '../../commands/fork-model';
import { revertRevision } from '../../commands/revert-revision';
import { saveRevision } from '../../commands/save-revision';
import { tagRevision } from '../../commands/tag-revision';
import { Revision, User, Workspace, type SetupModel } from '../../models';
import { DEMO_WORKSPACE_NAME } from '../demo-data';
import type { SeedContext } from '../index';

// The demo club's hangar, with histories that span two seasons. All invented: the
// club, its members and their airframes. The setups grow out of the fixtures in
// fixtures/valid/ by small edits, each one a save a pilot would plausibly make.

type Member = 'owner' | 'editor';
const EMAILS: Record<Member, string> = { owner: 'owner@demo.example', editor: 'editor@demo.example' };

interface Step {
  at: string;
  by: Member;
  message: string;
  /** The setup text of this revision, or the number of the revision it reverts to. */
  text?: string;
  revertTo?: number;
  tags?: string[];
}

const fixture = (name: string): string =>
  readFileSync(fileURLToPath(new URL(`../../../fixtures/valid/${name}`, import.meta.url)), 'utf8');

/** Replaces `from` once; a fixture that no longer contains it stops the seed with a clear reason. */
function edit(text: string, from: string | RegExp, to: string): string {
  const found = typeof from === 'string' ? text.includes(from) : from.test(text);
  if (!found)
    throw new Error(
      `Demo seed: the fixture text no longer contains ${String(from)}; update api/seed/steps/0002-demo-models.ts.`,
    );
  return text.replace(from, to);
}

/** The fixture's own opening comment replaced by one about the demo airframe. */
function withHeader(text: string, header: string): string {
  const lines = text.split('\n');
  const first = lines.findIndex((line) => !line.startsWith('#'));
  return `${header
    .split('\n')
    .map((line) => `# ${line}`.trimEnd())
    .join('\n')}\n${lines.slice(first).join('\n')}`;
}

const without = (text: string, pattern: RegExp): string =>
  text
    .split('\n')
    .filter((line) => !pattern.test(line))
    .join('\n');

// Kestrel Mk II: the club's two-receiver, 16-channel scale project. Revision 4 is the
// fixture as it stands; the first three show the wing receiver arriving, bound fresh
// with its pins on channels 1-8 and a throttle failsafe left from its last airframe,
// then remapped to 9-16, then the failsafe fixed.
function kestrelHistory(): Step[] {
  const current = withHeader(
    fixture('scale-16-channel-two-receivers.yaml'),
    "Kestrel Mk II: Hattie's scale low wing with split flaps, retracts, lights and drop tanks.",
  );
  const [fuselagePart, wingPart] = current.split('  - id: wing\n');
  if (wingPart === undefined) throw new Error('Demo seed: the scale fixture has no wing receiver.');
  const failsafeLeftOver =
    fuselagePart +
    '  - id: wing\n' +
    edit(wingPart, '{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 988 }');
  const [fuselageAgain, wingAgain] = failsafeLeftOver.split('  - id: wing\n');
  const freshlyBound =
    fuselageAgain +
    '  - id: wing\n' +
    wingAgain.replace(/\{ pin: (\d), ch: \d+,\s+/g, (_match, pin: string) => `{ pin: ${pin}, ch: ${pin}, `);
  const power = current.slice(current.indexOf('power:'));
  const fuselageOnly =
    edit(
      without(
        without(
          without(fuselagePart, /^ {2}- \{ ch: (9|1[0-6]),/),
          /^ {2}- \{ id: (tailwheel|nav-lights|landing|tank-left|tank-right|canopy|cowl-flaps|pilot-head), /,
        ),
        /^ {2}- \{ id: (light-switch|drop-switch|canopy-switch|cowl-knob), /,
      ),
      'channels: 16',
      'channels: 8',
    ).trimEnd() +
    '\n' +
    power;

  const r5 = edit(current, 'weight: 92, expo: 15', 'weight: 92, expo: 20');
  const r6 = edit(r5, 'weights: [100, 60]', 'weights: [100, 65]').replace('weights: [100, 60]', 'weights: [100, 65]');
  const r7 = edit(r6, 'to: 2, weight: -3, offset: -3,', 'to: 2, weight: -4, offset: -4,');
  const r8 = edit(r7, 'to: 9, weight: 80 }', 'to: 9, weight: 70 }');
  const r9 = edit(r8, 'to: 16, weight: 50 }', 'to: 16, weight: 40 }');
  const r10 = edit(r9, 'weight_g: 6200', 'weight_g: 6450');
  const r11 = edit(r10, 'from: cowl-knob,      to: 15 }', 'from: throttle-stick, to: 15 }');

  return [
    {
      at: '2025-02-08T10:12:00Z',
      by: 'owner',
      message: 'First channel plan: the fuselage receiver carries channels 1-8',
      text: fuselageOnly,
    },
    {
      at: '2025-02-15T14:40:00Z',
      by: 'owner',
      message: 'Plan channels 9-16 (lights, tailwheel, drop tanks, canopy, cowl, pilot head); bind the wing receiver',
      text: freshlyBound,
    },
    {
      at: '2025-02-16T09:05:00Z',
      by: 'editor',
      message: "Remap the wing receiver's pins 1-8 to channels 9-16",
      text: failsafeLeftOver,
    },
    {
      at: '2025-02-16T09:31:00Z',
      by: 'owner',
      message: 'Wing receiver pin 1 failsafe 988 -> 1500 µs: the tailwheel centres instead of running to its stop',
      text: current,
    },
    { at: '2025-03-22T16:20:00Z', by: 'owner', message: 'Elevator expo 15 -> 20 after the taxi tests', text: r5 },
    {
      at: '2025-04-05T08:45:00Z',
      by: 'owner',
      message: 'Aileron low rate 60 -> 65 for the maiden',
      text: r6,
      tags: ['maiden'],
    },
    {
      at: '2025-05-17T11:02:00Z',
      by: 'editor',
      message: 'Flap compensation -6 -> -8 after trimming flights',
      text: r7,
    },
    {
      at: '2025-07-12T18:30:00Z',
      by: 'owner',
      message: 'Tailwheel 80 -> 70: too twitchy on the grass strip',
      text: r8,
    },
    {
      at: '2025-09-27T15:10:00Z',
      by: 'owner',
      message: 'Pilot head follows the rudder at 40 %, end of season',
      text: r9,
      tags: ['season-2025'],
    },
    {
      at: '2026-02-14T13:00:00Z',
      by: 'owner',
      message: 'Winter rebuild: new retracts, weight 6200 -> 6450 g',
      text: r10,
    },
    { at: '2026-03-07T10:15:00Z', by: 'editor', message: 'Try the cowl flaps on the throttle stick', text: r11 },
    {
      at: '2026-03-21T09:40:00Z',
      by: 'owner',
      message: 'Cowl flaps back on their knob: they shut at idle on the approach',
      revertTo: 10,
      tags: ['season-2026'],
    },
  ];
}

// Sedge 3.4: Tomas's thermal glider, the layout Hattie's Heron is forked from.
function sedgeHistory(): Step[] {
  const layout = withHeader(
    fixture('glider-six-wing-servos.yaml'),
    "Sedge 3.4: Tomas's thermal glider, six wing servos on one receiver, crow on the slider.",
  );
  const firstCut = edit(layout, 'to: 5, weight: -60 }', 'to: 5, weight: -50 }').replace(
    'to: 6, weight: -60 }',
    'to: 6, weight: -50 }',
  );
  return [
    {
      at: '2025-03-01T19:30:00Z',
      by: 'editor',
      message: 'Sedge as built: crow with the flaps at -50',
      text: firstCut,
      tags: ['maiden'],
    },
    {
      at: '2025-04-12T17:05:00Z',
      by: 'editor',
      message: 'More crow: flaps -50 -> -60 for steeper landings',
      text: layout,
      tags: ['season-2025'],
    },
  ];
}

function heronSteps(source: string): Step[] {
  const renamed = edit(edit(source, 'name: Sedge 3.4', 'name: Heron 3.6'), 'wingspan_mm: 3400', 'wingspan_mm: 3600');
  const softer = edit(renamed, 'to: 1, weight: 70, expo: 30 }', 'to: 1, weight: 65, expo: 35 }').replace(
    'to: 2, weight: 70, expo: 30 }',
    'to: 2, weight: 65, expo: 35 }',
  );
  return [
    {
      at: '2025-11-08T14:00:00Z',
      by: 'owner',
      message: 'Heron: the Sedge layout on the longer 3.6 m wing',
      text: renamed,
    },
    {
      at: '2026-04-18T12:20:00Z',
      by: 'owner',
      message: 'Softer ailerons for the bigger wing: 70 -> 65, expo 30 -> 35',
      text: softer,
      tags: ['maiden'],
    },
  ];
}

// Meadowlark 40: the club trainer everyone learns on.
function meadowlarkHistory(): Step[] {
  const trainer = withHeader(
    fixture('trainer-single-receiver.yaml'),
    'Meadowlark 40: the club trainer, flown on a buddy lead on Saturday mornings.',
  );
  const gentler = edit(
    trainer,
    'rates: { control: rate-switch, weights: [100, 70] } }\n  - { id: elevator',
    'rates: { control: rate-switch, weights: [100, 60] } }\n  - { id: elevator',
  );
  const expo = edit(gentler, 'to: 2, expo: 20,', 'to: 2, expo: 25,');
  return [
    {
      at: '2024-09-14T09:00:00Z',
      by: 'editor',
      message: 'Club trainer as set up for the open day',
      text: trainer,
      tags: ['maiden'],
    },
    {
      at: '2025-03-08T09:15:00Z',
      by: 'editor',
      message: 'Aileron low rate 70 -> 60 for first solos',
      text: gentler,
      tags: ['season-2025'],
    },
    {
      at: '2026-03-14T08:50:00Z',
      by: 'owner',
      message: 'Elevator expo 20 -> 25 for the new intake of students',
      text: expo,
      tags: ['season-2026'],
    },
  ];
}

interface Context {
  sequelize: SeedContext['sequelize'];
  transaction: Transaction;
  workspace: Workspace;
  members: Record<Member, User>;
}

async function continueHistory(context: Context, model: SetupModel, steps: Step[], firstNumber: number): Promise<void> {
  const { sequelize, transaction, members } = context;
  for (const [index, step] of steps.entries()) {
    const base = firstNumber + index - 1;
    const common = {
      modelId: model.id,
      author: members[step.by],
      base,
      message: step.message,
      createdAt: new Date(step.at),
      transaction,
    };
    const revision =
      step.revertTo !== undefined
        ? await revertRevision(sequelize, { ...common, number: step.revertTo })
        : await saveRevision(sequelize, { ...common, yaml: step.text! });
    await tagAll(context, model, revision, step);
  }
}

async function tagAll(context: Context, model: SetupModel, revision: Revision, step: Step): Promise<void> {
  for (const name of step.tags ?? []) {
    await tagRevision(context.sequelize, {
      model,
      revision,
      author: context.members[step.by],
      name,
      createdAt: new Date(step.at),
      transaction: context.transaction,
    });
  }
}

async function history(
  context: Context,
  name: string,
  steps: Step[],
): Promise<{ model: SetupModel; revisions: Revision[] }> {
  const [first, ...rest] = steps;
  const { model, revision } = await createModel(context.sequelize, {
    workspace: context.workspace,
    author: context.members[first.by],
    name,
    yaml: first.text!,
    message: first.message,
    createdAt: new Date(first.at),
    transaction: context.transaction,
  });
  await tagAll(context, model, revision, first);
  await continueHistory(context, model, rest, 2);
  const revisions = await Revision.findAll({
    where: { modelId: model.id },
    order: [['number', 'ASC']],
    transaction: context.transaction,
  });
  return { model, revisions };
}

export async function run({ sequelize }: SeedContext): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({
      where: { name: DEMO_WORKSPACE_NAME },
      order: [['createdAt', 'ASC']],
      transaction,
    });
    if (!workspace)
      throw new Error(`Demo seed: the workspace "${DEMO_WORKSPACE_NAME}" is missing; step 0001 makes it.`);
    const members = {} as Record<Member, User>;
    for (const [member, email] of Object.entries(EMAILS) as [Member, string][]) {
      const user = await User.findOne({ where: { email }, transaction });
      if (!user) throw new Error(`Demo seed: the demo account ${email} is missing; step 0001 makes it.`);
      members[member] = user;
    }
    const context: Context = { sequelize, transaction, workspace, members };

    await history(context, 'Kestrel Mk II', kestrelHistory());
    await history(context, 'Meadowlark 40', meadowlarkHistory());
    const sedge = await history(context, 'Sedge 3.4', sedgeHistory());

    const source = sedge.revisions[sedge.revisions.length - 1];
    const [forkStep, ...heronRest] = heronSteps(source.yamlText);
    const { model: heron } = await forkModel(sequelize, {
      source: { model: sedge.model, revision: source },
      workspace,
      author: members.owner,
      name: 'Heron 3.6',
      message: `Forked from Tomas's Sedge 3.4, revision ${source.number}`,
      createdAt: new Date('2025-11-08T13:45:00Z'),
      transaction,
    });
    await continueHistory(context, heron, [forkStep, ...heronRest], 2);

    await history(context, 'Wren Twin', [
      {
        at: '2026-04-25T20:10:00Z',
        by: 'editor',
        message: 'Wren Twin drawn up from the kit plan; not flown yet',
        text: withHeader(fixture('every-field.yaml'), "Wren Twin: Tomas's twin-motor club hack, set up on the bench."),
      },
    ]);
  });
}
