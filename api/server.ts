/** Starts the HTTP server on the configured loopback port. */
import { createApp } from './app';
import { queueDigests } from './mail/digest';
import { loadConfig } from './config';
import { createSequelize, schemaMigrator } from './db';
import { whileDatabaseAway } from './health/retry';
import type { RunJobs } from './runs/run-jobs';

// the last line of defence: background work handles its own failures, and anything that slips through is logged, not fatal
process.on('unhandledRejection', (reason) => {
  console.error('unhandled rejection (the server keeps running):', reason);
});

const config = loadConfig();
const sequelize = createSequelize(config);
await whileDatabaseAway(() => sequelize.authenticate(), { label: 'connecting to the database', forMs: 10 * 60_000 });
await schemaMigrator(sequelize).up();
const app = createApp({ config, sequelize });
app.locals.mail.start();
// weekly digests for licensees who chose them: checked at start and every hour
const digests = () => queueDigests(sequelize, config.PUBLIC_URL).then((n) => { if (n) app.locals.mail.kick(); }, (err: unknown) => console.error('queueing digests failed:', err));
void digests();
const digestTimer = setInterval(() => void digests(), 3_600_000);
digestTimer.unref();
const server = app.listen(config.PORT, config.HOST, () => {
  console.log(`Brinkmark is serving on http://${config.HOST}:${config.PORT}`);
});

function shutdown(): void {
  clearInterval(digestTimer);
  app.locals.mail.stop();
  // open event streams would hold close() for ever: they end after a grace period
  setTimeout(() => server.closeAllConnections(), 2_000).unref();
  server.close(() => {
    app.locals.sessionStore.stopExpiringSessions();
    void (app.locals.runJobs as RunJobs).close().then(() => sequelize.close()).catch(() => undefined).then(() => process.exit(0));
  });
  // keep-alive connections would hold close() open
  server.closeIdleConnections();
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
