import type { Role } from '@shared/contract/roles';

// The invented scenario of the demo: a small model flying club and four of its
// members, one per workspace role. Any likeness to a real club is accidental.
export const DEMO_WORKSPACE_NAME = 'Tinwhistle Fen Model Flyers';
export const DEMO_PASSWORD = 'bindery-demo-1';

export const DEMO_ACCOUNTS: { email: string; name: string; role: Role }[] = [
  { email: 'owner@demo.example', name: 'Hattie Brambleby', role: 'owner' },
  { email: 'editor@demo.example', name: 'Tomas Quillfeather', role: 'editor' },
  { email: 'reviewer@demo.example', name: 'Ines Marchbank', role: 'reviewer' },
  { email: 'viewer@demo.example', name: 'Rafe Dunmoor', role: 'viewer' },
];
