/** The Sequelize connection to MariaDB, every model initialised then associated, and the migrators. */
import { resolve } from 'node:path';
import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import type { Config } from './config';
import { AuditEvent } from './audit/audit-event.model';
import { Advisory } from './advisories/advisory.model';
import { BoardRules, Comment, Correction, Decision, Vote } from './board/board.models';
import { Dataset } from './datasets/dataset.model';
import { OutboxMail } from './mail/outbox.model';
import { Invoice, StripeEvent, Subscription } from './subscriptions/subscription.models';
import { Proposal } from './proposals/proposal.model';
import { Run } from './runs/run.model';
import { Region } from './regions/region.model';
import { Stock } from './stocks/stock.model';
import { User } from './users/user.model';

const models = [User, Region, Stock, AuditEvent, Dataset, Run, Proposal, BoardRules, Comment, Vote, Decision, Advisory, Correction, OutboxMail, Subscription, StripeEvent, Invoice];

/**
 * Opens a pool to the configured MariaDB database and registers every model on it. Models are
 * bound to one instance per process (a Sequelize 6 rule): pass withModels=false for a bare pool.
 */
export function createSequelize(config: Config, { withModels = true } = {}): Sequelize {
  const sequelize = new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    host: config.DB_HOST,
    port: config.DB_PORT,
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    // why: fail fast while MariaDB is away (requests answer 503), and drop dead connections so the pool reconnects by itself
    pool: { max: 10, min: 0, idle: 10_000, acquire: 10_000, evict: 1000 },
    dialectOptions: { connectTimeout: 3000 },
  });
  if (!withModels) return sequelize;
  for (const m of models) m.initModel(sequelize);
  for (const m of models) if ('associate' in m) (m as { associate(): void }).associate();
  return sequelize;
}

type Step = (params: { context: ReturnType<Sequelize['getQueryInterface']> }) => Promise<void>;

function migrator(sequelize: Sequelize, folder: string, table: string): Umzug<ReturnType<Sequelize['getQueryInterface']>> {
  return new Umzug({
    migrations: {
      glob: ['[0-9]*.ts', { cwd: resolve(import.meta.dirname, '..', folder) }],
      // why: the default resolver require()s the file, which cannot load our ES-module TypeScript
      resolve: ({ name, path }) => ({
        name,
        up: async (p) => ((await import(path!)) as { up: Step }).up(p),
        down: async (p) => ((await import(path!)) as { down: Step }).down(p),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: table }),
    logger: undefined,
  });
}

/** Schema migrations in migrations/ (recorded in migrations_meta). */
export const schemaMigrator = (sequelize: Sequelize) => migrator(sequelize, 'migrations', 'migrations_meta');

/** Demo-data seeders in seeders/ (recorded in seeders_meta). */
export const demoSeeder = (sequelize: Sequelize) => migrator(sequelize, 'seeders', 'seeders_meta');
