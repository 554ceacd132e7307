import 'server-only';
import { Sequelize } from 'sequelize';
import mariadb from 'mariadb';

// One pooled connection for the whole server process. Kept on globalThis so that
// hot reloads in development do not open a new pool each time.
const globalForDb = globalThis as unknown as { outturnSequelize?: Sequelize };

function createSequelize(): Sequelize {
  return new Sequelize({
    dialect: 'mariadb',
    dialectModule: mariadb,
    host: process.env.DB_HOST ?? '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3307),
    database: process.env.DB_NAME ?? 'outturn',
    username: process.env.DB_USER ?? 'outturn',
    password: process.env.DB_PASSWORD,
    timezone: '+00:00',
    // Neither Sequelize nor the driver may write bound values (password hashes, tokens) to
    // a log or into an error message.
    logging: false,
    dialectOptions: { logParam: false },
    pool: { max: 10, min: 0, idle: 10_000 },
  });
}

export const sequelize: Sequelize = globalForDb.outturnSequelize ?? createSequelize();
globalForDb.outturnSequelize = sequelize;
