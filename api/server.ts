/** Starts the HTTP server on the configured loopback port. */
import { createApp } from './app';
import { loadConfig } from './config';
import { createSequelize, schemaMigrator } from './db';
import { RunQueue } from './runs/run-queue';

const config = loadConfig();
const sequelize = createSequelize(config);
await sequelize.authenticate();
await schemaMigrator(sequelize).up();
const interrupted = await RunQueue.recoverInterrupted();
if (interrupted) console.log(`${interrupted} run(s) interrupted by the last stop were marked failed.`);
const app = createApp({ config, sequelize });
app.locals.mail.start();
const server = app.listen(config.PORT, config.HOST, () => {
  console.log(`Brinkmark is serving on http://${config.HOST}:${config.PORT}`);
});

function shutdown(): void {
  app.locals.mail.stop();
  server.close(() => {
    app.locals.sessionStore.stopExpiringSessions();
    void sequelize.close().then(() => process.exit(0));
  });
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
