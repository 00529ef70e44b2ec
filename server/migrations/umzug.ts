import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationParams } from 'umzug';
import * as accounts from './0001-accounts';
import * as sketches from './0002-sketches';
import * as mail from './0003-mail';
import * as shareRecipients from './0004-share-recipients';
import * as sharedState from './0006-shared-state';

/** A migration step: receives the query interface, never the models (they change, migrations do not). */
export type Migration = (params: MigrationParams<QueryInterface>) => Promise<void>;

interface MigrationModule {
  up: Migration;
  down: Migration;
}

/** Every migration, in order. Add new files at the end; never edit one that has shipped. */
const steps: [name: string, module: MigrationModule][] = [
  ['0001-accounts', accounts],
  ['0002-sketches', sketches],
  ['0003-mail', mail],
  ['0004-share-recipients', shareRecipients],
  ['0006-shared-state', sharedState],
];

export function createMigrator(sequelize: Sequelize): Umzug<QueryInterface> {
  return new Umzug<QueryInterface>({
    migrations: steps.map(([name, module]) => ({ name, up: module.up, down: module.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
