import { z } from 'zod';

// The setup document, format bindery-setup/1 (see docs/format.md). Objects are loose:
// unknown keys survive validation and are reported by the `unknown-key` check instead
// of failing the schema, because docs/format.md says they are kept, never dropped.

export const FORMAT_ID = 'bindery-setup/1';

export const SLUG_PATTERN = /^[a-z0-9][a-z0-9-]{0,39}$/;
const slug = () =>
  z.string().regex(SLUG_PATTERN, {
    message: 'must be lower-case letters, digits and dashes, starting with a letter or digit, at most 40 characters',
  });

const channelNumber = () => z.int().min(1).max(32);
const pinNumber = () => z.int().min(1).max(32);
const switchPosition = () => z.int().min(0);

export const AIRFRAMES = ['airplane', 'glider', 'helicopter', 'multirotor', 'vtol', 'car', 'boat', 'other'] as const;
export const CONTROL_KINDS = ['axis', 'knob', 'slider', 'switch'] as const;
export const CHANNEL_ROLES = [
  'aileron',
  'elevator',
  'rudder',
  'throttle',
  'flap',
  'gear',
  'brake',
  'steering',
  'light',
  'payload',
  'aux',
  'collective',
  'gyro',
  'mode',
] as const;
/** What drives the model (second edition): absent means electric for a powered airframe. */
export const MOTORS = ['electric', 'fuel', 'turbine', 'none'] as const;
/** Where a throttle channel's motor stops (second edition, evaluation rule 7). */
export const THROTTLE_STOPS = ['low', 'center'] as const;
export const SIDES = ['left', 'right'] as const;
export const RECEIVER_ROLES = ['primary', 'secondary'] as const;
export const RECEIVER_SUPPLIES = ['esc-bec', 'separate-pack', 'both'] as const;
export const FAILSAFE_MODES = ['hold', 'off'] as const;

export const DEFAULT_TRAVEL = { low_us: 1000, center_us: 1500, high_us: 2000, reverse: false } as const;
export const DEFAULT_SWITCH_POSITIONS = 2;

export const modelSchema = z.looseObject({
  name: z.string().min(1).max(80),
  airframe: z.enum(AIRFRAMES),
  wingspan_mm: z.number().positive().optional(),
  length_mm: z.number().positive().optional(),
  weight_g: z.number().positive().optional(),
  notes: z.string().optional(),
  motor: z.enum(MOTORS).optional(),
});

export const linkSchema = z.looseObject({
  channels: z.int().min(4).max(32),
  packet_rate_hz: z.number().positive().optional(),
});

// A switch carries `positions`; the other kinds must not, so the kinds are two shapes.
export const switchControlSchema = z.looseObject({
  id: slug(),
  kind: z.literal('switch'),
  positions: z.int().min(2).max(3).default(DEFAULT_SWITCH_POSITIONS),
  label: z.string().optional(),
});

export const proportionalControlSchema = z.looseObject({
  id: slug(),
  kind: z.enum(['axis', 'knob', 'slider']),
  positions: z.never({ message: 'positions is only for switches' }).optional(),
  label: z.string().optional(),
});

export const controlSchema = z.discriminatedUnion('kind', [switchControlSchema, proportionalControlSchema]);

export const travelSchema = z.looseObject({
  low_us: z.number().default(DEFAULT_TRAVEL.low_us),
  center_us: z.number().default(DEFAULT_TRAVEL.center_us),
  high_us: z.number().default(DEFAULT_TRAVEL.high_us),
  reverse: z.boolean().default(DEFAULT_TRAVEL.reverse),
});

export const cutSchema = z.looseObject({
  control: slug(),
  position: switchPosition(),
  value: z.number().min(-100).max(100),
});

export const channelSchema = z.looseObject({
  ch: channelNumber(),
  function: slug(),
  role: z.enum(CHANNEL_ROLES),
  side: z.enum(SIDES).optional(),
  travel: travelSchema.default({ ...DEFAULT_TRAVEL }),
  cut: cutSchema.optional(),
  // Throttle channels only; the default depends on the airframe (see throttleStop).
  stop: z.enum(THROTTLE_STOPS).optional(),
}).superRefine((channel, ctx) => {
  if (channel.stop !== undefined && channel.role !== 'throttle')
    ctx.addIssue({ code: 'custom', path: ['stop'], message: 'stop is only for throttle channels' });
});

export const ratesSchema = z.looseObject({
  control: slug(),
  weights: z.array(z.number().min(-200).max(200)).min(2).max(3),
});

export const activeSchema = z.looseObject({
  control: slug(),
  positions: z.array(switchPosition()).min(1),
});

export const mixSchema = z.looseObject({
  id: slug(),
  from: slug(),
  to: channelNumber(),
  weight: z.number().min(-200).max(200).default(100),
  offset: z.number().min(-100).max(100).default(0),
  expo: z.number().min(0).max(100).default(0),
  rates: ratesSchema.optional(),
  active: activeSchema.optional(),
});

export const failsafeSchema = z.union([z.number(), z.enum(FAILSAFE_MODES)]).optional();

export const pinMapEntrySchema = z.looseObject({
  pin: pinNumber(),
  ch: channelNumber(),
  failsafe: failsafeSchema,
});

export const receiverSchema = z.looseObject({
  id: slug(),
  label: z.string().optional(),
  role: z.enum(RECEIVER_ROLES).default('primary'),
  outputs: z.int().min(1).max(32),
  telemetry: z.boolean().default(true),
  map: z.array(pinMapEntrySchema).default([]),
});

export const powerSchema = z.looseObject({
  receiver_supply: z.enum(RECEIVER_SUPPLIES).optional(),
});

// A warning or info the pilot has looked at and accepts; identity key rule + path.
export const acceptedSchema = z.looseObject({
  rule: z.string().min(1),
  path: z.string(),
  reason: z.string().min(1),
});

export const setupSchema = z.looseObject({
  format: z.literal(FORMAT_ID),
  model: modelSchema,
  link: linkSchema,
  controls: z.array(controlSchema).min(1),
  channels: z.array(channelSchema),
  mixes: z.array(mixSchema).default([]),
  receivers: z.array(receiverSchema).min(1),
  power: powerSchema.optional(),
  accepted: z.array(acceptedSchema).optional(),
});

export type Setup = z.output<typeof setupSchema>;
export type SetupInput = z.input<typeof setupSchema>;
export type Model = z.output<typeof modelSchema>;
export type Link = z.output<typeof linkSchema>;
export type Control = z.output<typeof controlSchema>;
export type SwitchControl = z.output<typeof switchControlSchema>;
export type Channel = z.output<typeof channelSchema>;
export type Travel = z.output<typeof travelSchema>;
export type Cut = z.output<typeof cutSchema>;
export type Mix = z.output<typeof mixSchema>;
export type Rates = z.output<typeof ratesSchema>;
export type Active = z.output<typeof activeSchema>;
export type Receiver = z.output<typeof receiverSchema>;
export type PinMapEntry = z.output<typeof pinMapEntrySchema>;
export type Failsafe = z.output<typeof failsafeSchema>;
export type Power = z.output<typeof powerSchema>;
export type Accepted = z.output<typeof acceptedSchema>;
export type Motor = (typeof MOTORS)[number];
export type ThrottleStop = (typeof THROTTLE_STOPS)[number];
