// One source of database settings for sequelize-cli and the app (src/lib/db/connection.ts).
// DATABASE_URL wins; otherwise DB_HOST/DB_PORT/DB_USER/DB_PASSWORD/DB_NAME with local defaults
// that match docker-local/mariadb.
const fs = require('fs');
const path = require('path');

function loadDotEnv() {
  const file = path.resolve(__dirname, '..', '.env');
  if (!fs.existsSync(file)) return;
  for (const line of fs.readFileSync(file, 'utf8').split(/\r?\n/)) {
    const match = /^\s*([A-Z0-9_]+)\s*=\s*(.*)\s*$/.exec(line);
    if (match && process.env[match[1]] === undefined) process.env[match[1]] = match[2].replace(/^"(.*)"$/, '$1');
  }
}

function connectionSettings() {
  loadDotEnv();
  const common = {
    dialect: 'mariadb',
    logging: process.env.DB_LOG === '1' ? console.log : false,
    dialectOptions: { connectTimeout: 3000 },
    timezone: '+00:00',
    define: { underscored: true },
    pool: { max: Number(process.env.DB_POOL_MAX || 10), min: 0, acquire: 5000, idle: 10000 },
  };
  if (process.env.DATABASE_URL) {
    const url = new URL(process.env.DATABASE_URL);
    return {
      ...common,
      host: url.hostname,
      port: Number(url.port || 3306),
      username: decodeURIComponent(url.username),
      password: decodeURIComponent(url.password),
      database: url.pathname.replace(/^\//, ''),
    };
  }
  return {
    ...common,
    host: process.env.DB_HOST || '127.0.0.1',
    port: Number(process.env.DB_PORT || 3407),
    username: process.env.DB_USER || 'lobewise',
    password: process.env.DB_PASSWORD || 'lobewise-local',
    database: process.env.DB_NAME || 'lobewise_dev',
  };
}

const settings = connectionSettings();
module.exports = { development: settings, test: settings, production: settings, connectionSettings };
