import { stringify } from 'yaml';
import type { AIRFRAMES } from '@shared/format/schema';

export type Airframe = (typeof AIRFRAMES)[number];

// A scalar as YAML writes it, quoted only when it has to be (a name like "yes" or
// "12: x" would otherwise read back as something else).
const scalar = (value: string): string => stringify(value, { lineWidth: 0 }).trimEnd();

/**
 * The setup a new model starts from when none is given: one receiver, four sticks, a
 * guarded arm switch that cuts the motor, and failsafes that centre the surfaces and
 * stop the motor. It passes every check with no finding, so a pilot starts clean and
 * every later finding is one they introduced.
 */
export function starterSetup(name: string, airframe: Airframe = 'airplane'): string {
  return `# A starting point: one receiver with the four primary functions on channels 1-4.
# Rename the controls to match your transmitter and add channels as the model needs.
format: bindery-setup/1
model:
  name: ${scalar(name)}
  airframe: ${airframe}
link:
  channels: 8                 # channels the radio link carries in its current mode
controls:
  - { id: aileron-stick,  kind: axis }
  - { id: elevator-stick, kind: axis }
  - { id: throttle-stick, kind: axis }
  - { id: rudder-stick,   kind: axis }
  - { id: motor-arm,      kind: switch, positions: 2, label: Motor arm }
channels:
  - { ch: 1, function: aileron,  role: aileron }
  - { ch: 2, function: elevator, role: elevator }
  - { ch: 3, function: motor,    role: throttle,
      cut: { control: motor-arm, position: 0, value: -100 } }
  - { ch: 4, function: rudder,   role: rudder }
mixes:
  - { id: aileron,  from: aileron-stick,  to: 1 }
  - { id: elevator, from: elevator-stick, to: 2 }
  - { id: motor,    from: throttle-stick, to: 3 }
  - { id: rudder,   from: rudder-stick,   to: 4 }
receivers:
  - id: main
    label: Main receiver
    role: primary
    outputs: 6
    telemetry: true
    map:
      - { pin: 1, ch: 1, failsafe: 1500 }
      - { pin: 2, ch: 2, failsafe: 1500 }
      - { pin: 3, ch: 3, failsafe: 1000 }   # the motor stops on signal loss
      - { pin: 4, ch: 4, failsafe: 1500 }
`;
}
