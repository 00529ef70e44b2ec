import type { Sequelize } from 'sequelize';
import type { ServerConfig } from './config';
import { migrate } from './migrations/umzug';
import { seedDemoData, shouldSeedDemo } from './seed';

export interface Prepared {
  /** Migrations this start applied, in order. */
  applied: string[];
  /** Whether the demo data was added. */
  seeded: boolean;
}

/** What every start does to the database before serving: migrate under the lock, then seed when the rule says so. */
export async function prepareDatabase(sequelize: Sequelize, config: Pick<ServerConfig, 'seedDemo'>): Promise<Prepared> {
  const applied = await migrate(sequelize);
  const seeded = shouldSeedDemo(config.seedDemo, applied);
  if (seeded) await seedDemoData(sequelize);
  return { applied, seeded };
}
