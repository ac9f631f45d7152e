import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { analyzeSetup, type Analysis } from '@shared/analyze';

// The before/after fixture pairs of fixtures/pairs/ (each file says what it shows).
export const PAIRS = [
  'remap-second-receiver',
  'failsafe-fix',
  'trim-tuning',
  'renames',
  'receiver-added',
  'reorder',
] as const;
export type PairName = (typeof PAIRS)[number];

export interface PairSide extends Analysis {
  text: string;
}

export function pairFile(name: PairName, side: 'before' | 'after'): string {
  return fileURLToPath(new URL(`../../fixtures/pairs/${name}.${side}.yaml`, import.meta.url));
}

export function loadSide(name: PairName, side: 'before' | 'after'): PairSide {
  const text = readFileSync(pairFile(name, side), 'utf8');
  return { ...analyzeSetup(text), text };
}

export function loadPair(name: PairName): { before: PairSide; after: PairSide } {
  return { before: loadSide(name, 'before'), after: loadSide(name, 'after') };
}
