// Connection settings for sequelize-cli and the app alike, read from the environment
// (.env is loaded when present; variables already set win, so tests can point elsewhere).
const fs = require('fs');
const path = require('path');

const envFile = path.resolve(__dirname, '../../.env');
if (fs.existsSync(envFile)) process.loadEnvFile(envFile);

const base = {
  dialect: 'mariadb',
  host: process.env.DB_HOST || '127.0.0.1',
  port: Number(process.env.DB_PORT || 3307),
  database: process.env.DB_NAME || 'outturn',
  username: process.env.DB_USER || 'outturn',
  password: process.env.DB_PASSWORD,
  logging: false,
  timezone: '+00:00',
  define: { underscored: false },
  seederStorage: 'sequelize',
  seederStorageTableName: 'SequelizeSeeds',
};

module.exports = { development: base, test: base, production: base };
