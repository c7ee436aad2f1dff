import { Sequelize } from 'sequelize';
import { config } from '../config';

/** The one Sequelize instance. Only model and repository files import it. */
export const sequelize = new Sequelize(config.databaseUrl, {
  dialect: 'postgres',
  logging: false,
  define: { underscored: true },
  pool: { max: 10, min: 0, idle: 10_000, acquire: 10_000 },
  dialectOptions: { connectionTimeoutMillis: 3000 },
});
