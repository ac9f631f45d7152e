import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';

/** SEED_DEMO=0 leaves the demo accounts out (their password is public). */
export const demoEnabled = (): boolean => !['0', 'false', 'off'].includes(process.env.SEED_DEMO ?? '');

export function printDemoSignIns(): void {
  if (!demoEnabled()) return;
  console.log(`\nDemo sign-ins (workspace "${DEMO_WORKSPACE_NAME}", password ${DEMO_PASSWORD}):`);
  for (const account of DEMO_ACCOUNTS) console.log(`  ${account.role.padEnd(9)} ${account.email}`);
  console.log('');
}
