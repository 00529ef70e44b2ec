import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationParams } from 'umzug';
import { withExclusiveLock } from '../database';
import * as accounts from './0001-accounts';
import * as sketches from './0002-sketches';
import * as mail from './0003-mail';
import * as shareRecipients from './0004-share-recipients';
import * as classes from './0005-classes';
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
  ['0005-classes', classes],
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

/** The migration that creates the schema: applying it means the database was empty. */
export const FIRST_MIGRATION = steps[0][0];

/**
 * Applies every pending migration under the database's migration lock; returns the names applied.
 * Of several instances starting together, the first applies them and the others, once they get
 * the lock, find nothing pending.
 */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await withExclusiveLock(sequelize, 'migrations', () => createMigrator(sequelize).up());
  return applied.map((m) => m.name);
}
