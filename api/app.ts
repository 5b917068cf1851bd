/** createApp: the Express application (no listen), wired from config and a Sequelize connection. */
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import express, { Router } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { Sequelize } from 'sequelize';
import { advisoryRoutes } from './advisories/advisory.routes';
import { AdvisoryPublisher } from './advisories/advisory.publisher';
import { AdvisoryService } from './advisories/advisory.service';
import { auditRoutes } from './audit/audit.routes';
import { boardRoutes, proposalBoardRoutes } from './board/board.routes';
import { BoardService } from './board/board.service';
import { MailSender } from './mail/mail-sender';
import { createStripe, SubscriptionService } from './subscriptions/subscription.service';
import { stripeWebhookRoutes, subscriptionRoutes } from './subscriptions/subscription.routes';
import { mailRoutes } from './mail/mail.routes';
import { datasetRoutes, stockDatasetRoutes } from './datasets/dataset.routes';
import { proposalRoutes, stockProposalRoutes } from './proposals/proposal.routes';
import { RunJobs } from './runs/run-jobs';
import { runRoutes, stockRunRoutes } from './runs/run.routes';
import { authRoutes } from './auth/auth.routes';
import { usePasswordCost } from './auth/auth.service';
import { createPassport } from './auth/passport';
import { createSessionStore } from './auth/session-store';
import type { Config } from './config';
import { createCsrf, type Csrf } from './http/csrf';
import { HealthRegistry } from './health/health';
import { databaseCheck, healthRoutes } from './health/health.routes';
import { apiNotFound, errorHandler } from './http/error-handler';
import { regionRoutes } from './regions/region.routes';
import { stockRoutes } from './stocks/stock.routes';
import { userRoutes } from './users/user.routes';


export interface ApiMount {
  base: string;
  router: Router;
}

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  /** The run queue on Redis (one is made from the config when not given). */
  runJobs?: RunJobs;
}

/** The long-lived services routes share. */
interface Services {
  jobs: RunJobs;
  mail: MailSender;
  board: BoardService;
  advisories: AdvisoryService;
  subscriptions: SubscriptionService;
  csrf: Csrf;
  health: HealthRegistry;
}

/** Every API router and where it is mounted: the role matrix test walks this list. */
export function apiMounts({ config, sequelize }: AppDeps, passport: ReturnType<typeof createPassport>, { jobs, mail, board, advisories, subscriptions, csrf, health }: Services): ApiMount[] {
  const runs = { jobs, limitPerUser: config.RUN_LIMIT_PER_USER };
  return [
    { base: '/api/health', router: healthRoutes(health) },
    { base: '/api/auth', router: authRoutes(config, passport, csrf) },
    { base: '/api/users', router: userRoutes(sequelize) },
    { base: '/api/regions', router: regionRoutes() },
    { base: '/api/stocks', router: stockRoutes() },
    { base: '/api/stocks/:stockId/datasets', router: stockDatasetRoutes(sequelize) },
    { base: '/api/stocks/:stockId/runs', router: stockRunRoutes(sequelize, runs) },
    { base: '/api/stocks/:stockId/proposals', router: stockProposalRoutes(sequelize) },
    { base: '/api/datasets', router: datasetRoutes(sequelize) },
    { base: '/api/runs', router: runRoutes(sequelize, runs) },
    { base: '/api/proposals', router: proposalRoutes(sequelize, mail, config.PUBLIC_URL) },
    { base: '/api/proposals/:proposalId/board', router: proposalBoardRoutes(board) },
    { base: '/api/board', router: boardRoutes(board) },
    { base: '/api/advisories', router: advisoryRoutes(advisories) },
    { base: '/api/admin/mail', router: mailRoutes(config, sequelize, mail) },
    { base: '/api/subscriptions', router: subscriptionRoutes(subscriptions) },
    { base: '/api/audit-events', router: auditRoutes() },
  ];
}

/** Express's "trust proxy" setting from TRUST_PROXY: off when empty, a hop count, or a list of addresses. */
function trustProxy(value: string): boolean | number | string {
  const v = value.trim();
  if (v === '') return false;
  return /^\d+$/.test(v) ? Number(v) : v;
}

export function createApp(deps: AppDeps): express.Express {
  const { config, sequelize } = deps;
  const app = express();
  usePasswordCost(config.BCRYPT_ROUNDS);
  // why: X-Forwarded-For decides the sign-in limit's key; believe it only from a configured proxy
  app.set('trust proxy', trustProxy(config.TRUST_PROXY));
  app.disable('x-powered-by');

  app.use((_req, res, next) => {
    res.setHeader('X-Request-Id', randomUUID());
    next();
  });
  app.use(helmet({
    contentSecurityPolicy: {
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        // why: Angular Material and the CDK add style elements at run time
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'frame-ancestors': ["'none'"],
        'upgrade-insecure-requests': null,
      },
    },
  }));
  const jobs = deps.runJobs ?? new RunJobs(config);
  const mail = new MailSender(config);
  const publisher = new AdvisoryPublisher(mail, config.PUBLIC_URL);
  const health = new HealthRegistry();
  const services: Services = {
    jobs, mail, board: new BoardService(sequelize, publisher), advisories: new AdvisoryService(sequelize, publisher),
    subscriptions: new SubscriptionService(sequelize, createStripe(config), config),
    csrf: createCsrf({ secret: config.SESSION_SECRET, secureCookie: config.COOKIE_SECURE }), health,
  };
  health.register('database', databaseCheck(sequelize));
  health.register('queue', () => jobs.health());
  health.register('mail', () => mail.health());
  Object.assign(app.locals, { runJobs: jobs, mail, health });
  // private data and PDFs: never kept by a browser or a shared cache
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // before the JSON parser, the session and the CSRF check: Stripe signs the raw body and sends no cookie
  const webhook: ApiMount = { base: '/api/stripe', router: stripeWebhookRoutes(services.subscriptions) };
  app.use(webhook.base, webhook.router);
  app.use(express.json({ limit: '1mb' }));

  const store = createSessionStore(sequelize);
  app.locals.sessionStore = store;
  app.use(session({
    name: 'brinkmark.sid',
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'strict',
      secure: config.COOKIE_SECURE,
      maxAge: config.SESSION_MAX_AGE_HOURS * 3_600_000,
    },
  }));
  const passport = createPassport();
  app.use(passport.initialize());
  app.use(passport.session());
  app.use('/api', services.csrf.protection);

  const mounts = apiMounts(deps, passport, services);
  app.locals.apiMounts = [webhook, ...mounts];
  for (const m of mounts) app.use(m.base, m.router);
  app.use('/api', apiNotFound);

  const clientDir = resolve(config.CLIENT_DIR);
  if (existsSync(clientDir)) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root: clientDir }));
  }
  app.use(errorHandler);
  return app;
}
