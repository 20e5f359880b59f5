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
