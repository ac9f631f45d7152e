import { AIRFRAMES, CHANNEL_ROLES, FORMAT_ID, MOTORS, RECEIVER_SUPPLIES, THROTTLE_STOPS } from '../format/schema';

const SLUG = 'an id of lower-case letters, digits and dashes, starting with a letter or digit, at most 40 characters';
const PULSE = 'a pulse in microseconds (a number)';
const POSITION = 'a switch position (a whole number, 0 for the first position)';

// What each field must be, in words, keyed by its path with list indices written [].
// Used to explain schema findings in the terms of docs/format.md's field table.
export const FIELD_DESCRIPTIONS: Record<string, string> = {
  '': 'a mapping of format, model, link, controls, channels, mixes, receivers, power and accepted',
  format: `exactly "${FORMAT_ID}"`,
  model: 'a mapping with name and airframe',
  'model.name': 'a text of 1 to 80 characters',
  'model.airframe': `one of ${AIRFRAMES.join(', ')}`,
  'model.wingspan_mm': 'a number of millimetres above 0',
  'model.length_mm': 'a number of millimetres above 0',
  'model.weight_g': 'a number of grams above 0',
  'model.notes': 'a text',
  'model.motor': `one of ${MOTORS.join(', ')}`,
  link: 'a mapping with channels',
  'link.channels': 'a whole number from 4 to 32',
  'link.packet_rate_hz': 'a number above 0',
  controls: 'a list of at least one control',
  'controls[]': 'a mapping with id and kind',
  'controls[].id': SLUG,
  'controls[].kind': 'one of axis, knob, slider, switch',
  'controls[].positions': '2 or 3, and only on a switch',
  'controls[].label': 'a text',
  channels: 'a list of channel-plan entries',
  'channels[]': 'a mapping with ch, function and role',
  'channels[].ch': 'a channel number from 1 to 32',
  'channels[].function': SLUG,
  'channels[].role': `one of ${CHANNEL_ROLES.join(', ')}`,
  'channels[].side': 'left or right',
  'channels[].travel': 'a mapping of low_us, center_us, high_us and reverse',
  'channels[].travel.low_us': PULSE,
  'channels[].travel.center_us': PULSE,
  'channels[].travel.high_us': PULSE,
  'channels[].travel.reverse': 'true or false',
  'channels[].cut': 'a mapping of control, position and value',
  'channels[].cut.control': 'the id of a switch',
  'channels[].cut.position': POSITION,
  'channels[].cut.value': 'a percent from -100 to 100',
  'channels[].stop': `${THROTTLE_STOPS.join(' or ')}, and only on a throttle channel`,
  mixes: 'a list of mixes',
  'mixes[]': 'a mapping with id, from and to',
  'mixes[].id': SLUG,
  'mixes[].from': 'the id of a control',
  'mixes[].to': 'a channel number from 1 to 32',
  'mixes[].weight': 'a percent from -200 to 200',
  'mixes[].offset': 'a percent from -100 to 100',
  'mixes[].expo': 'a percent from 0 to 100',
  'mixes[].rates': 'a mapping of control and weights',
  'mixes[].rates.control': 'the id of a switch',
  'mixes[].rates.weights': 'a list of 2 or 3 weights, one per switch position',
  'mixes[].rates.weights[]': 'a percent from -200 to 200',
  'mixes[].active': 'a mapping of control and positions',
  'mixes[].active.control': 'the id of a switch',
  'mixes[].active.positions': 'a list of at least one switch position',
  'mixes[].active.positions[]': POSITION,
  receivers: 'a list of at least one receiver',
  'receivers[]': 'a mapping with id and outputs',
  'receivers[].id': SLUG,
  'receivers[].label': 'a text',
  'receivers[].role': 'primary or secondary',
  'receivers[].outputs': 'a whole number of output pins from 1 to 32',
  'receivers[].telemetry': 'true or false',
  'receivers[].map': 'a list of pin entries',
  'receivers[].map[]': 'a mapping with pin and ch',
  'receivers[].map[].pin': 'a pin number from 1 to 32',
  'receivers[].map[].ch': 'a channel number from 1 to 32',
  'receivers[].map[].failsafe': 'a pulse in microseconds, hold or off',
  power: 'a mapping with receiver_supply',
  'power.receiver_supply': `one of ${RECEIVER_SUPPLIES.join(', ')}`,
  accepted: 'a list of accepted findings',
  'accepted[]': 'a mapping of rule, path and reason',
  'accepted[].rule': 'the id of a check',
  'accepted[].path': 'the path of the finding, as the check reports it',
  'accepted[].reason': 'a text saying why the finding is accepted',
};

export function fieldPattern(dataPath: readonly (string | number)[]): string {
  let out = '';
  for (const step of dataPath) {
    if (typeof step === 'number') out += '[]';
    else out += out === '' ? step : `.${step}`;
  }
  return out;
}
