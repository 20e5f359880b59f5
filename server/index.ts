import { networkInterfaces } from 'node:os';
import pino from 'pino';
import { createApp } from './app';
import { configFromEnv } from './config';
import { createSequelize } from './db';
import { photoSweep } from './services/build-log-photos';
import { defaultPhotoStorage } from './services/photo-storage';

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

// Photo files whose rows went by cascade (a hull or an account deleted) are removed once at start-up and
// then every six hours; the timer never keeps the process alive on its own.
const SWEEP_EVERY_MS = 6 * 60 * 60 * 1000;
const photoLog = pino({ level: config.logLevel, name: 'photos' });
const sweepPhotos = () =>
  photoSweep(defaultPhotoStorage(config.dataDir), { log: photoLog })
    .then((removed) => removed.length > 0 && photoLog.info({ removed: removed.length }, 'removed photo files no row names'))
    .catch((err: unknown) => photoLog.error({ err }, 'photo sweep failed'));
void sweepPhotos();
setInterval(() => void sweepPhotos(), SWEEP_EVERY_MS).unref();

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
