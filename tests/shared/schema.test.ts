import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Ajv2020 from 'ajv/dist/2020';
import { describe, expect, it } from 'vitest';
import { SETUP_SCHEMA_FILE, setupJsonSchema, setupJsonSchemaText } from '@shared/format/json-schema';
import { setupSchema } from '@shared/format/schema';
import { parseYaml } from '@shared/parse/parse-yaml';
import { invalidFixtures, readFixture, validFixtures } from './setup-fixtures';

const committed = readFileSync(fileURLToPath(new URL(`../../${SETUP_SCHEMA_FILE}`, import.meta.url)), 'utf8');
const ajv = new Ajv2020({ strict: true });
const validate = ajv.compile(setupJsonSchema());

function dataOf(text: string): unknown {
  const parsed = parseYaml(text);
  if (!parsed.readable) throw new Error('unreadable');
  return parsed.data;
}

const trainer = dataOf(readFixture('valid/trainer-single-receiver.yaml')) as Record<string, any>;

// Changes to the trainer that the format must reject, and a few it must accept.
const mutations: [string, (d: Record<string, any>) => void, boolean][] = [
  ['format of another version', (d) => (d.format = 'bindery-setup/2'), false],
  ['no model name', (d) => delete d.model.name, false],
  ['model name of 81 characters', (d) => (d.model.name = 'x'.repeat(81)), false],
  ['an airframe not in the list', (d) => (d.model.airframe = 'kite'), false],
  ['weight of zero', (d) => (d.model.weight_g = 0), false],
  ['link of 3 channels', (d) => (d.link.channels = 3), false],
  ['link of 4.5 channels', (d) => (d.link.channels = 4.5), false],
  ['no controls', (d) => (d.controls = []), false],
  ['a control id with capitals', (d) => (d.controls[0].id = 'Aileron'), false],
  ['a control kind not in the list', (d) => (d.controls[0].kind = 'wheel'), false],
  ['positions on an axis', (d) => (d.controls[0].positions = 2), false],
  ['a 4-position switch', (d) => (d.controls[4].positions = 4), false],
  ['channel 33', (d) => (d.channels[0].ch = 33), false],
  ['a role not in the list', (d) => (d.channels[0].role = 'winch'), false],
  ['side up', (d) => (d.channels[0].side = 'up'), false],
  ['travel reverse as text', (d) => (d.channels[0].travel = { reverse: 'yes' }), false],
  ['cut value past 100', (d) => (d.channels[2].cut.value = -120), false],
  ['cut position -1', (d) => (d.channels[2].cut.position = -1), false],
  ['mix weight 250', (d) => (d.mixes[2].weight = 250), false],
  ['mix expo -5', (d) => (d.mixes[2].expo = -5), false],
  ['mix without to', (d) => delete d.mixes[2].to, false],
  ['rates with one weight', (d) => (d.mixes[0].rates.weights = [100]), false],
  ['active without positions', (d) => (d.mixes[0].active = { control: 'rate-switch', positions: [] }), false],
  ['no receivers', (d) => (d.receivers = []), false],
  ['receiver with 40 outputs', (d) => (d.receivers[0].outputs = 40), false],
  ['receiver role spare', (d) => (d.receivers[0].role = 'spare'), false],
  ['failsafe keep', (d) => (d.receivers[0].map[0].failsafe = 'keep'), false],
  ['pin 0', (d) => (d.receivers[0].map[0].pin = 0), false],
  ['power supply solar', (d) => (d.power.receiver_supply = 'solar'), false],
  ['unknown keys everywhere', (d) => ((d.extra = 1), (d.model.colour = 'red'), (d.mixes[0].note = 'x')), true],
  ['no mixes, no power', (d) => (delete d.mixes, delete d.power), true],
  [
    'failsafe off and hold',
    (d) => ((d.receivers[0].map[0].failsafe = 'off'), (d.receivers[0].map[1].failsafe = 'hold')),
    true,
  ],
  ['a 3-position switch with labels', (d) => ((d.controls[4].positions = 3), (d.controls[4].label = 'Rates')), true],
];

describe('the published JSON Schema', () => {
  it('is up to date with the zod schema (npm run schema:write)', () => {
    expect(committed).toBe(setupJsonSchemaText());
  });

  it('is draft 2020-12 and lets unknown keys through', () => {
    const schema = JSON.parse(committed);
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.additionalProperties).toEqual({});
  });

  // [json-schema-2020-12] ajv's 2020-12 validator must agree with the zod schema.
  it.each(
    [...validFixtures(), ...invalidFixtures()].filter((f) => parseYaml(f.text).readable).map((f) => [f.name, f.text]),
  )('agrees with zod on fixture %s', (_, text) => {
    const data = dataOf(text);
    expect(validate(data)).toBe(setupSchema.safeParse(data).success);
  });

  it.each(mutations)('agrees with zod on the trainer with %s', (_, mutate, accepted) => {
    const data = structuredClone(trainer);
    mutate(data);
    expect(setupSchema.safeParse(data).success).toBe(accepted);
    expect(validate(data)).toBe(accepted);
  });
});

describe('defaults', () => {
  const setup = setupSchema.parse(trainer);

  it('fill in what docs/format.md says', () => {
    expect(setup.controls.find((c) => c.id === 'rate-switch')).toMatchObject({ kind: 'switch', positions: 2 });
    expect(setup.controls.find((c) => c.id === 'aileron-stick')).not.toHaveProperty('positions');
    // [arduino-servo] the default travel is 1000 / 1500 / 2000 microseconds
    expect(setup.channels[0].travel).toEqual({ low_us: 1000, center_us: 1500, high_us: 2000, reverse: false });
    expect(setup.mixes.find((m) => m.id === 'motor')).toMatchObject({ weight: 100, offset: 0, expo: 0 });
    expect(setup.receivers[0]).toMatchObject({ role: 'primary', telemetry: true });
  });

  it('fill in the rest of a travel that is given in part', () => {
    const data = structuredClone(trainer);
    data.channels[0].travel = { reverse: true };
    expect(setupSchema.parse(data).channels[0].travel).toEqual({
      low_us: 1000,
      center_us: 1500,
      high_us: 2000,
      reverse: true,
    });
  });

  it('leave an unset failsafe unset', () => {
    const data = structuredClone(trainer);
    delete data.receivers[0].map[0].failsafe;
    expect(setupSchema.parse(data).receivers[0].map[0]).not.toHaveProperty('failsafe');
  });
});
