import { describe, expect, it } from 'vitest';
import { DatabaseError, UniqueConstraintError } from 'sequelize';
import { inPreparedTransaction, preparedStatement, runPrepared } from '@api/db/prepared';
import { describeError } from '@api/middleware/error-handler';
import { createUser } from './helpers/factories';
import { useTestApp } from './helpers/test-app';

const harness = useTestApp();

describe('prepared statements', () => {
  it('answers rows, again and again on the pooled connections that prepared them', async () => {
    const statement = preparedStatement('test-sum', 'SELECT $1::int + $2::int AS sum');
    for (let round = 0; round < 15; round += 1) {
      const rows = await runPrepared<{ sum: number }>(harness.sequelize, statement, [round, 2]);
      expect(rows).toEqual([{ sum: round + 2 }]);
    }
  });

  it('refuses one name with two texts, which would run the plan of the other', () => {
    preparedStatement('test-twice', 'SELECT 1');
    expect(preparedStatement('test-twice', 'SELECT 1').text).toBe('SELECT 1');
    expect(() => preparedStatement('test-twice', 'SELECT 2')).toThrow(/two texts/);
  });

  it("raises PostgreSQL's refusal as Sequelize's DatabaseError, so bad input is a 400", async () => {
    const statement = preparedStatement('test-uuid', 'SELECT $1::uuid AS id');
    const failure = await runPrepared(harness.sequelize, statement, ['not-a-uuid']).catch((error: unknown) => error);
    expect(failure).toBeInstanceOf(DatabaseError);
    expect(describeError(failure)).toMatchObject({ status: 400, code: 'invalid-input' });
    // The connection went back to the pool in good order.
    expect(await runPrepared(harness.sequelize, statement, ['5d3a2c1e-0000-4000-8000-000000000001'])).toEqual([
      { id: '5d3a2c1e-0000-4000-8000-000000000001' },
    ]);
  });

  it("raises a unique violation as Sequelize's UniqueConstraintError, a 409 as through Sequelize", async () => {
    const user = await createUser();
    // The same row again: its id and email are taken.
    const statement = preparedStatement('test-unique', 'INSERT INTO users SELECT * FROM users WHERE id = $1');
    const failure = await runPrepared(harness.sequelize, statement, [user.id]).catch((error: unknown) => error);
    expect(failure).toBeInstanceOf(UniqueConstraintError);
    expect(describeError(failure)).toMatchObject({ status: 409, code: 'conflict' });
  });

  it('commits the work of a transaction of its own, and rolls back all of it when the work fails', async () => {
    const user = await createUser({ name: 'Before' });
    const rename = preparedStatement('test-rename', 'UPDATE users SET name = $2 WHERE id = $1');
    const nameOf = preparedStatement('test-name-of', 'SELECT name FROM users WHERE id = $1');
    const failure = await inPreparedTransaction(harness.sequelize, async (run) => {
      await run(rename, [user.id, 'Rolled back']);
      throw new Error('the work failed');
    }).catch((error: unknown) => error);
    expect(failure).toEqual(new Error('the work failed'));
    expect(await runPrepared(harness.sequelize, nameOf, [user.id])).toEqual([{ name: 'Before' }]);
    const answer = await inPreparedTransaction(harness.sequelize, async (run) => {
      await run(rename, [user.id, 'Committed']);
      return run(nameOf, [user.id]);
    });
    expect(answer).toEqual([{ name: 'Committed' }]);
    expect(await runPrepared(harness.sequelize, nameOf, [user.id])).toEqual([{ name: 'Committed' }]);
  });
});
