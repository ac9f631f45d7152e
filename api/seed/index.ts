import type { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { withAdvisoryLock } from '../db/migrate';
import { initModels } from '../models';
import * as demoClub from './steps/0001-demo-club';
import * as demoModels from './steps/0002-demo-models';
import * as demoShelf from './steps/0003-demo-shelf';
import * as demoReviews from './steps/0004-demo-reviews';

export interface SeedContext {
  sequelize: Sequelize;
}

const SEED_LOCK = 74_226_002;

// Demo data, each step run once per database and recorded in seed_steps, so a step
// added by a later change runs on the next start of an existing installation too.
// A new step is a file in steps/ plus one line here.
const steps: { name: string; run: (context: SeedContext) => Promise<void> }[] = [
  { name: '0001-demo-club', run: demoClub.run },
  { name: '0002-demo-models', run: demoModels.run },
  { name: '0003-demo-shelf', run: demoShelf.run },
  { name: '0004-demo-reviews', run: demoReviews.run },
];

/** Runs the demo steps not yet recorded; answers the names run. */
export async function seedDemo(sequelize: Sequelize): Promise<string[]> {
  initModels(sequelize);
  const seeder = new Umzug<SeedContext>({
    migrations: steps.map(({ name, run }) => ({ name, up: ({ context }) => run(context) })),
    context: { sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'seed_steps' }),
    logger: undefined,
  });
  const ran = await withAdvisoryLock(sequelize, SEED_LOCK, () => seeder.up());
  return ran.map((step) => step.name);
}
