import { readFileSync } from 'node:fs';
import path from 'node:path';
import { analyzeSetup } from '@shared/analyze';

// The demo setup (two receivers, 16 channels; fixtures/valid says what it shows) and
// the slip it guards against: the wing receiver's map copied from the fuselage one.

export const demoSetup = readFileSync(path.resolve('fixtures/valid/scale-16-channel-two-receivers.yaml'), 'utf8');

const WING_MAP = `      - { pin: 1, ch: 9,  failsafe: 1500 }
      - { pin: 2, ch: 10, failsafe: hold }
      - { pin: 3, ch: 11, failsafe: hold }
      - { pin: 4, ch: 12, failsafe: hold }
      - { pin: 5, ch: 13, failsafe: hold }
      - { pin: 6, ch: 14, failsafe: hold }
      - { pin: 7, ch: 15, failsafe: 1500 }
      - { pin: 8, ch: 16, failsafe: 1500 }
`;

const COPIED_MAP = `      - { pin: 1, ch: 1,  failsafe: 1500 }
      - { pin: 2, ch: 2,  failsafe: hold }
      - { pin: 3, ch: 3,  failsafe: hold }
      - { pin: 4, ch: 4,  failsafe: hold }
      - { pin: 5, ch: 5,  failsafe: hold }
      - { pin: 6, ch: 6,  failsafe: hold }
      - { pin: 7, ch: 7,  failsafe: 1500 }
      - { pin: 8, ch: 8,  failsafe: 1500 }
`;

if (!demoSetup.includes(WING_MAP)) throw new Error('The demo fixture no longer has the wing map these tests copy over');

export const copiedWingSetup = demoSetup.replace(WING_MAP, COPIED_MAP);

/** The plain value the server stores as a revision's document. */
export const documentOf = (text: string): unknown => analyzeSetup(text).data;
