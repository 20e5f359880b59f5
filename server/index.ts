import { networkInterfaces } from 'node:os';
import { createApp } from './app';
import { configFromEnv } from './config';
import { createSequelize } from './db';

// The process that listens. Everything else is in createApp() so that tests build the same app.
const config = configFromEnv();
const sequelize = createSequelize(config.db);
const app = createApp({ config, sequelize });

const server = app.listen(config.port, config.host, () => {
  const urls =
    config.host === '0.0.0.0'
      ? Object.values(networkInterfaces())
          .flat()
          .filter((n) => n && n.family === 'IPv4')
          .map((n) => `http://${n!.address}:${config.port}/`)
      : [`http://${config.host}:${config.port}/`];
  process.stdout.write(`\n  Loftbench (${config.mode}) is ready:\n${urls.map((u) => `    ${u}`).join('\n')}\n  Press Ctrl-C to stop.\n\n`);
});

let closing = false;
function shutDown() {
  if (closing) return;
  closing = true;
  server.close(() => {
    sequelize.close().finally(() => process.exit(0));
  });
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGTERM', shutDown);
process.on('SIGINT', shutDown);
