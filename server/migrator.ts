import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';
import * as m0001 from './migrations/0001-accounts-and-hulls';
import * as m0002 from './migrations/0002-sessions';
import * as m0003 from './migrations/0003-plan-revisions';
import * as m0004 from './migrations/0004-collaboration';
import * as m0005 from './migrations/0005-build-log';
import * as m0006 from './migrations/0006-cut-list-arrangements';

export type Migration = MigrationFn<QueryInterface>;

// Listed explicitly rather than globbed so that the order is reviewable and nothing depends on how the
// files are loaded (tsx now, a bundle later).
const migrations = [
  { name: '0001-accounts-and-hulls', ...m0001 },
  { name: '0002-sessions', ...m0002 },
  { name: '0003-plan-revisions', ...m0003 },
  { name: '0004-collaboration', ...m0004 },
  { name: '0005-build-log', ...m0005 },
  { name: '0006-cut-list-arrangements', ...m0006 },
];

/** The umzug migrator over this database; applied migrations are recorded in the `migrations_applied` table. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: migrations.map(({ name, up, down }) => ({ name, up, down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'migrations_applied' }),
    logger: undefined,
  });
}
