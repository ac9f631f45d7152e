import { inject } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';
import type { Role } from '@shared/contract/roles';

export { DEMO_PASSWORD, DEMO_WORKSPACE_NAME };

/** Where the app under test listens (tests/e2e/global-setup.ts). */
export const baseUrl = inject('e2eBaseUrl');

export interface DemoAccount {
  email: string;
  name: string;
  role: Role;
}

/** The seeded demo member with this role. */
export function demoAccount(role: Role): DemoAccount {
  const account = DEMO_ACCOUNTS.find((candidate) => candidate.role === role);
  if (!account) throw new Error(`The demo seed has no ${role}.`);
  return account;
}
