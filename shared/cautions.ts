// The usual cautions where a setup is about to be programmed or flown (docs/design.md,
// capability 11), written once for the screens, the field sheet and its PDF. Sources as
// docs/sources.md names them: [back-feed] is common practice, [ama-safety-code], [cap-658]
// and [turbine-failsafe] are published rules.

export interface Caution {
  title: string;
  body: string;
}

export const CAUTIONS_HEADING = 'Cautions before programming or flying';

export const CAUTIONS: readonly Caution[] = [
  {
    title: 'Bench-test with the propeller removed',
    body: 'Take the propeller or rotor off before powering the model on the bench; a motor can start when a channel or failsafe is wrong.',
  },
  {
    title: 'Power a bench receiver from its own pack only with the ESC’s power lead disconnected',
    body: 'A separate pack in parallel with the ESC’s built-in regulator can back-feed it and destroy it. Disconnect the ESC’s red (positive) lead while a receiver pack is connected.',
  },
  {
    title: 'Range check before a first flight',
    body: 'Do a ground range check before the first flight of a new or repaired model, as the AMA safety code asks.',
  },
  {
    title: 'Test the failsafe with the model restrained',
    body: 'Hold or tie the model down, switch the transmitter off and watch every pin go to its failsafe: throttle to idle or off, control surfaces to neutral.',
  },
  {
    title: 'Heavy models and turbines',
    body: 'UK rules require the failsafe to bring the throttle to idle for models over 7 kg and for turbines (CAA CAP 658, now CAP 722F). After a failsafe a turbine must go to idle or shut down within the time your code of practice or the event sets (for example two seconds).',
  },
  {
    title: 'Your national body and local law come first',
    body: 'Follow your national model-flying body’s safety code and the law where you fly. Bindery is a record and a checker, not a certification: a clean check does not make a model airworthy.',
  },
];
