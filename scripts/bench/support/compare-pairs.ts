import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseDocument } from 'yaml';
import { makeStressSetup } from '../../../fixtures/stress';

// The revision pairs the compare benchmarks time, in process and through the API.

type Edit = (doc: ReturnType<typeof parseDocument>) => void;

/**
 * The second revision is the first with a typical save's edits. Both texts come from
 * the same serialiser, so the text diff sees only the edited lines.
 */
function revisions(text: string, edit: Edit): [string, string] {
  const before = parseDocument(text);
  const after = parseDocument(text);
  edit(after);
  return [before.toString({ lineWidth: 0 }), after.toString({ lineWidth: 0 })];
}

const DEMO_TEXT = readFileSync(
  fileURLToPath(new URL('../../../fixtures/valid/scale-16-channel-two-receivers.yaml', import.meta.url)),
  'utf8',
);

export const demoPair = revisions(DEMO_TEXT, (doc) => {
  doc.setIn(['mixes', 0, 'weight'], 80);
  doc.setIn(['receivers', 1, 'map', 2, 'failsafe'], 1400);
  doc.setIn(['link', 'packet_rate_hz'], 150);
});

const stressEdits: Edit = (doc) => {
  for (const index of [5, 77, 150, 230]) doc.setIn(['mixes', index, 'expo'], 15);
  doc.setIn(['mixes', 40, 'id'], 'mix-41-renamed');
  doc.setIn(['receivers', 2, 'map', 3, 'failsafe'], 1400);
};

/** The stress setup (32 channels, 4 receivers, 300 mixes) before and after a save's edits. */
export const stressPair = revisions(makeStressSetup(), stressEdits);

/**
 * `count` stress pairs with the same edits, each pair's first revision differing from
 * the others' in one mix weight, so that no two pairs share a content hash.
 */
export function distinctStressPairs(count: number): [string, string][] {
  return Array.from({ length: count }, (_, index) => {
    const start = parseDocument(makeStressSetup());
    start.setIn(['mixes', 1, 'weight'], 40 + index);
    return revisions(start.toString({ lineWidth: 0 }), stressEdits);
  });
}
