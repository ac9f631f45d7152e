// The pre-maiden checklist a reviewer works through. The field checks cannot be made
// from the setup document; the reviewer ticks each one as confirmed. Sources are the
// labels of docs/sources.md; items without one say so.

export interface ChecklistItem {
  id: string;
  label: string;
  detail: string;
  /** The outside reference, when there is one. */
  source: { label: string; title: string } | null;
  /** Where the item comes from when no published source names it. */
  basis: string | null;
  /**
   * The top-level parts of the setup document the item depends on: a tick carries to a
   * later revision when all of them are unchanged. Null for an item made before each
   * flight, which never carries.
   */
  covers: readonly CoveredPart[] | null;
}

/** Top-level keys of a bindery-setup/1 document (docs/format.md), with the words the review uses for them. */
export const COVERED_PART_WORDS = {
  model: 'the model block (airframe, weight)',
  link: 'the link',
  controls: 'the controls',
  channels: 'the channels',
  mixes: 'the mixes',
  receivers: 'the receivers, their pins and failsafes',
  power: 'the receiver power',
} as const;
export type CoveredPart = keyof typeof COVERED_PART_WORDS;

export const PRE_MAIDEN_CHECKLIST: readonly ChecklistItem[] = [
  {
    id: 'control-directions',
    label: 'Control directions',
    detail: 'Every surface moves the right way for each stick, switch and mix, on every rate.',
    source: null,
    basis: 'Common practice, no published source.',
    covers: ['controls', 'channels', 'mixes', 'receivers'],
  },
  {
    id: 'throws-measured',
    label: 'Throws measured',
    detail:
      'Throws and rates measured at the surfaces and matching what the setup intends; no servo stalls at its end points.',
    source: null,
    basis: 'Common practice, no published source.',
    covers: ['channels', 'mixes', 'receivers'],
  },
  {
    id: 'failsafe-tested',
    label: 'Failsafe tested',
    detail:
      'With the model restrained and the propeller off, switch the transmitter off: the throttle goes to closed or idle and every pin goes where the setup says.',
    source: {
      label: 'cap-658',
      title: 'UK CAA CAP 658 (now CAP 722F), as summarised by the BMFA, "Thinking About Fail-safes"',
    },
    basis: null,
    covers: ['channels', 'receivers'],
  },
  {
    id: 'range-check',
    label: 'Ground range check',
    detail:
      'A ground range check before the first flight of a new or repaired model, with every receiver bound and powered.',
    source: {
      label: 'ama-safety-code',
      title: 'Academy of Model Aeronautics, National Model Aircraft Safety Code, Radio Control B.2',
    },
    basis: null,
    covers: ['link', 'receivers'],
  },
  {
    id: 'range-check-each-receiver',
    label: 'Range check each receiver on its own',
    detail:
      'Range check again with only one receiver powered at a time: each unit must hold the link by itself, since the failure two receivers are fitted for is one of them losing it.',
    source: {
      label: 'ama-safety-code',
      title:
        'Academy of Model Aeronautics, National Model Aircraft Safety Code, Radio Control B.2 (one unit at a time is common practice)',
    },
    basis: null,
    covers: ['link', 'receivers'],
  },
  {
    id: 'bind-check',
    label: 'Bind check: every receiver answers',
    detail:
      'With the transmitter on, every receiver of the setup shows it is bound and moves its own pins; a unit re-bound for this model is checked again for the settings its binding may have cleared.',
    source: null,
    basis: 'Common practice, no published source.',
    covers: ['link', 'receivers'],
  },
  {
    id: 'arm-switch-stops-motor',
    label: 'Arm switch stops the motor',
    detail:
      'With the propeller off and the model restrained, throttle up a little, then flip the arm switch to its safe position: the motor stops and stays stopped whatever the throttle stick does.',
    source: null,
    basis: 'Common practice, no published source.',
    covers: ['controls', 'channels', 'mixes'],
  },
  {
    id: 'centre-of-gravity',
    label: 'Centre of gravity',
    detail: 'Balanced at the designed point with the flight pack fitted, ready to fly.',
    source: null,
    basis: 'Common practice, no published source.',
    covers: ['model'],
  },
  {
    id: 'battery-charge',
    label: 'Battery charge',
    detail: 'Flight and receiver packs charged and checked before the flight.',
    source: null,
    basis: 'Common practice, no published source.',
    covers: null,
  },
  {
    id: 'receiver-power',
    label: 'Receiver power wiring',
    detail:
      'Each receiver is powered as the setup says; with a separate receiver pack, the ESC’s red lead is disconnected so it cannot back-feed.',
    source: {
      label: 'back-feed',
      title: 'Model-club guidance on receiver packs beside an ESC’s regulator (common practice, no standard)',
    },
    basis: null,
    covers: ['power', 'receivers'],
  },
];

export const CHECKLIST_IDS = PRE_MAIDEN_CHECKLIST.map((item) => item.id);

/** The covered parts in words, joined for a sentence. */
export function coveredWords(parts: readonly CoveredPart[]): string {
  const words = parts.map((part) => COVERED_PART_WORDS[part]);
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} and ${words.at(-1)}`;
}

export const isChecklistItem = (id: string): boolean => CHECKLIST_IDS.includes(id);
