import { Sequelize } from 'sequelize';

/** Opens the Sequelize connection pool; queries are logged only at debug level. */
export function connectDatabase(url: string, log?: (sql: string) => void): Sequelize {
  return new Sequelize(url, {
    dialect: 'postgres',
    logging: log ?? false,
    pool: { max: 10, min: 0, idle: 10000 },
  });
}
