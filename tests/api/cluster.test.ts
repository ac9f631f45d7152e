import { chmodSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort, isRoot, serverUserCanReach } from '@api/db/cluster';

const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-cluster-'));
chmodSync(folder, 0o755);
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('cluster helpers', () => {
  it('freePort keeps a free preferred port and moves off a taken one', async () => {
    const preferred = await freePort();
    expect(await freePort(preferred)).toBe(preferred);
    const blocker = net.createServer();
    await new Promise<void>((resolve) => blocker.listen(preferred, '127.0.0.1', resolve));
    try {
      const other = await freePort(preferred);
      expect(other).not.toBe(preferred);
      expect(other).toBeGreaterThan(0);
    } finally {
      await new Promise((resolve) => blocker.close(resolve));
    }
  });

  // Only as root does the server run as another user, who may be kept out of a folder.
  it.runIf(isRoot())('tells whether the postgres user can reach a folder', async () => {
    const open = path.join(folder, 'open');
    const closed = path.join(folder, 'closed');
    mkdirSync(path.join(closed, 'inner'), { recursive: true });
    mkdirSync(open);
    chmodSync(open, 0o755);
    chmodSync(closed, 0o700);
    expect(await serverUserCanReach(open)).toBe(true);
    expect(await serverUserCanReach(path.join(closed, 'inner'))).toBe(false);
  });
});
