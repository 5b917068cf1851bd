/** createApp: the Express application (no listen), wired from config and a Sequelize connection. */
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import connectSessionSequelize from 'connect-session-sequelize';
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
import { RunQueue } from './runs/run-queue';
import { runRoutes, stockRunRoutes } from './runs/run.routes';
import { authRoutes } from './auth/auth.routes';
import { createPassport } from './auth/passport';
import type { Config } from './config';
import { csrfProtection } from './http/csrf';
import { apiNotFound, errorHandler } from './http/error-handler';
import { regionRoutes } from './regions/region.routes';
import { stockRoutes } from './stocks/stock.routes';
import { userRoutes } from './users/user.routes';

const SequelizeStore = connectSessionSequelize(session.Store);

export interface ApiMount {
  base: string;
  router: Router;
}

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  /** The queue that runs model runs in worker threads (one is made when not given). */
  runQueue?: RunQueue;
}

/** The long-lived services routes share. */
interface Services {
  queue: RunQueue;
  mail: MailSender;
  board: BoardService;
  advisories: AdvisoryService;
  subscriptions: SubscriptionService;
}

/** Every API router and where it is mounted: the role matrix test walks this list. */
export function apiMounts({ config, sequelize }: AppDeps, passport: ReturnType<typeof createPassport>, { queue, mail, board, advisories, subscriptions }: Services): ApiMount[] {
  return [
    { base: '/api/auth', router: authRoutes(config, passport) },
    { base: '/api/users', router: userRoutes(sequelize) },
    { base: '/api/regions', router: regionRoutes() },
    { base: '/api/stocks', router: stockRoutes() },
    { base: '/api/stocks/:stockId/datasets', router: stockDatasetRoutes(sequelize) },
    { base: '/api/stocks/:stockId/runs', router: stockRunRoutes(sequelize, queue) },
    { base: '/api/stocks/:stockId/proposals', router: stockProposalRoutes(sequelize) },
    { base: '/api/datasets', router: datasetRoutes(sequelize) },
    { base: '/api/runs', router: runRoutes(sequelize, queue) },
    { base: '/api/proposals', router: proposalRoutes(sequelize, mail) },
    { base: '/api/proposals/:proposalId/board', router: proposalBoardRoutes(board) },
    { base: '/api/board', router: boardRoutes(board) },
    { base: '/api/advisories', router: advisoryRoutes(advisories) },
    { base: '/api/admin/mail', router: mailRoutes(config) },
    { base: '/api/subscriptions', router: subscriptionRoutes(subscriptions) },
    { base: '/api/audit-events', router: auditRoutes() },
  ];
}

export function createApp(deps: AppDeps): express.Express {
  const { config, sequelize } = deps;
  const app = express();
  app.set('trust proxy', 'loopback');
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
  const queue = deps.runQueue ?? new RunQueue();
  const mail = new MailSender(config);
  const publisher = new AdvisoryPublisher(mail, config.PUBLIC_URL);
  const services: Services = {
    queue, mail, board: new BoardService(sequelize, publisher), advisories: new AdvisoryService(sequelize, publisher),
    subscriptions: new SubscriptionService(sequelize, createStripe(config), config),
  };
  Object.assign(app.locals, { runQueue: queue, mail });
  // before the JSON parser, the session and the CSRF check: Stripe signs the raw body and sends no cookie
  const webhook: ApiMount = { base: '/api/stripe', router: stripeWebhookRoutes(services.subscriptions) };
  app.use(webhook.base, webhook.router);
  app.use(express.json({ limit: '1mb' }));

  const store = new SequelizeStore({ db: sequelize, tableName: 'sessions', checkExpirationInterval: 15 * 60_000 });
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
  app.use('/api', csrfProtection);

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
