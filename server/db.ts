import { Sequelize, type Transaction } from 'sequelize';
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
export interface ConnectorConnection {
  query(sql: string, values?: readonly unknown[]): Promise<unknown>;
}

/** What the connector answers to an INSERT, UPDATE or DELETE. */
export interface WriteResult {
  affectedRows: number;
  /** A BigInt from this connector version unless it fits; Number() it. */
  insertId: number | bigint;
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
    const rows = (await (connection as unknown as ConnectorConnection).query(sql, values)) as unknown[];
    // The connector's result array also carries a `meta` property; copy out the rows alone.
    return Array.from(rows) as Row[];
  } finally {
    manager.releaseConnection(connection);
  }
}

/**
 * Run `work` in one transaction straight through the MariaDB connector: inside `outer` (a Sequelize
 * transaction, on its connection) when given, else in a transaction of its own on a connection borrowed from
 * Sequelize's pool. For the plan save: `work` can send its statements without waiting for each answer (the
 * connector pipelines them, in order, on the one connection), where Sequelize's own transaction costs a round
 * trip and its query machinery per statement. A throw from `work` rolls the transaction back.
 */
export async function connectorTransaction<T>(sequelize: Sequelize, outer: Transaction | undefined, work: (connection: ConnectorConnection) => Promise<T>): Promise<T> {
  // Inside an outer transaction, that one commits or rolls back as a whole.
  if (outer) return work((outer as unknown as { connection: ConnectorConnection }).connection);
  const manager = sequelize.connectionManager;
  const connection = (await manager.getConnection({ type: 'write' })) as unknown as ConnectorConnection;
  const release = () => manager.releaseConnection(connection as never);
  try {
    await connection.query('START TRANSACTION');
  } catch (err) {
    release();
    throw err;
  }
  let value: T;
  try {
    value = await work(connection);
    await connection.query('COMMIT');
  } catch (err) {
    try {
      await connection.query('ROLLBACK');
      release();
    } catch {
      // A connection that cannot roll back is in an unknown state: it must not go back to the pool.
      await manager.destroyConnection(connection as never);
    }
    throw err;
  }
  release();
  return value;
}
