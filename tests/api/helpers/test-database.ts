import { randomBytes } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { inject } from 'vitest';
import { createDatabase, dropDatabase, withDatabase } from '@api/db/databases';
import { createSequelize } from '@api/db/sequelize';
import { settleRecordings } from '@api/provenance/record-later';

export interface TestDatabase {
  name: string;
  url: string;
  sequelize: Sequelize;
  close(): Promise<void>;
}

/** A fresh database cloned from the migrated template, dropped again by `close`. */
export async function openTestDatabase(): Promise<TestDatabase> {
  const serverUrl = inject('apiTestServerUrl');
  const name = `test_${randomBytes(6).toString('hex')}`;
  await createDatabase(serverUrl, name, { template: inject('apiTestTemplate') });
  const url = withDatabase(serverUrl, name);
  const sequelize = createSequelize(url);
  return {
    name,
    url,
    sequelize,
    close: async () => {
      // A save's provenance is recorded after its answer: let the last ones finish.
      await settleRecordings(sequelize);
      await sequelize.close();
      await dropDatabase(serverUrl, name);
    },
  };
}
