import { Sequelize } from 'sequelize';
import type { Config } from './config';

/** One Sequelize instance per server process, on the MariaDB that scripts/ started. */
export function createSequelize(db: Config['db']): Sequelize {
  return new Sequelize(db.name, db.user, db.password, {
    dialect: 'mariadb',
    host: db.host,
    port: db.port,
    logging: false,
    pool: { max: 20, min: 0, idle: 10_000 },
    dialectOptions: { connectTimeout: 10_000 },
    define: { underscored: true },
  });
}

/** What the MariaDB connector's connection offers for a plain query (its own typings are not a dependency of ours). */
interface ConnectorConnection {
  query(sql: string, values: readonly unknown[]): Promise<unknown[]>;
}

/**
 * A SELECT straight through the MariaDB connector, on a connection borrowed from Sequelize's own pool.
 * For the one query every hull request makes (who is on the crew): Sequelize's query() costs about four
 * times the connector's CPU for a one-row SELECT (measured here: about 265 against 64 microseconds), and
 * on the plan read that was most of the server's time. Rows come back as plain objects keyed by column.
 */
export async function selectRows<Row>(sequelize: Sequelize, sql: string, values: readonly unknown[]): Promise<Row[]> {
  const manager = sequelize.connectionManager;
  const connection = await manager.getConnection({ type: 'read' });
  try {
    const rows = await (connection as unknown as ConnectorConnection).query(sql, values);
    // The connector's result array also carries a `meta` property; copy out the rows alone.
    return Array.from(rows) as Row[];
  } finally {
    manager.releaseConnection(connection);
  }
}
