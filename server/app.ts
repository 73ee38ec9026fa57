import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import session from 'express-session';
import { DEFAULTS } from '../shared/budget/limits';
import { AccountsService } from './accounts/accounts-service';
import { accountsRoutes } from './accounts/accounts-routes';
import { createPassport, resetLimiter, signInLimiters, throttleSettings } from './accounts/auth-setup';
import { auditRoutes } from './audit/audit-routes';
import { AuditService } from './audit/audit-service';
import { budgetsRoutes } from './budgets/budgets-routes';
import { BudgetsService } from './budgets/budgets-service';
import { ComputeSupervisor } from './compute/supervisor';
import { loadConfig, type AppConfig } from './config';
import { openDatabase, type Connection } from './db/connection';
import { DrizzleSessionStore } from './db/session-store';
import { putSettingIfAbsent } from './db/settings-repository';
import { apiNotFound, errorHandler } from './http/error-handler';
import { sameOriginOnly } from './http/origin-check';
import { NO_STORE, staticClient } from './http/static-client';
import { RouteTable, type RouteInfo } from './http/routes';
import { mailRoutes } from './mail/mail-routes';
import { MailService } from './mail/mail-service';
import { reportsRoutes } from './reports/reports-routes';
import { ReportsService } from './reports/reports-service';
import { reviewsRoutes } from './reviews/reviews-routes';
import { ReviewsService } from './reviews/reviews-service';
import { AttachmentsService } from './uploads/attachments-service';
import { uploadsRoutes } from './uploads/uploads-routes';

const SESSION_COOKIE = 'dubito.sid';

export interface Services {
  accounts: AccountsService;
  budgets: BudgetsService;
  reviews: ReviewsService;
  audit: AuditService;
  attachments: AttachmentsService;
  mail: MailService;
  reports: ReportsService;
}

export interface DubitoApp {
  app: Express;
  config: AppConfig;
  connection: Connection;
  services: Services;
  /** The compute supervisor: budgets, reports and diffs run in its worker threads. */
  pool: ComputeSupervisor;
  /** Every API route with the access rule it is registered with. */
  routes: RouteInfo[];
  close(): Promise<void>;
}

/** Builds the whole server without listening on a port. */
export async function createApp(overrides: Partial<AppConfig> = {}): Promise<DubitoApp> {
  const config = loadConfig(process.env, overrides);
  const connection = openDatabase(config.dbFile);
  const { db } = connection;
  const secret = config.sessionSecret ?? putSettingIfAbsent(db, 'session_secret', randomBytes(32).toString('hex'));
  const store = new DrizzleSessionStore(db, connection.dataVersion);
  const mail = await MailService.create(db, { smtpUrl: config.smtpUrl, from: config.mailFrom, log: config.log });
  const pool = new ComputeSupervisor({
    size: config.computeWorkers,
    queueLength: config.computeQueueLength,
    jobsPerUser: config.computeJobsPerUser,
    workerHeapMb: config.workerHeapMb,
    trialsCap: config.trialsCap,
    timeoutMs: config.computeTimeoutMs,
    engineModule: config.engineModule,
    log: config.log,
  });

  const audit = new AuditService(db);
  const accounts = new AccountsService({
    db,
    audit,
    mail,
    publicUrl: config.publicUrl,
    endSessionsOf: (id) => store.destroyForUser(id),
    dataVersion: connection.dataVersion,
    invitationHours: config.invitationHours,
    resetHours: config.resetHours,
    passwordAttempts: throttleSettings(config.signIn),
    log: config.log,
  });
  const budgets = new BudgetsService(db, pool, audit, { diffMaxBytes: config.diffMaxBytes });
  const attachments = new AttachmentsService({ db, budgets, audit, dataDir: resolve(config.dataDir) });
  const services: Services = {
    accounts,
    budgets,
    reviews: new ReviewsService({ db, budgets, attachments, audit, accounts, mail, publicUrl: config.publicUrl }),
    audit,
    attachments,
    mail,
    reports: new ReportsService({ budgets, attachments, workers: pool, maxBytes: config.reportMaxBytes }),
  };
  const passport = createPassport(accounts);

  const app = express();
  app.disable('x-powered-by');
  // API answers are `no-store`; hashing every body for an entity tag would be wasted (static files keep theirs).
  app.set('etag', false);
  app.set('trust proxy', config.trustProxy);
  // gzip or brotli for whatever is not already compressed: the API's JSON, and client files the build left plain.
  app.use(compression());
  app.use((_req, res, next) => {
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Referrer-Policy', 'same-origin');
    res.setHeader('X-Frame-Options', 'DENY');
    next();
  });

  const api = express.Router();
  api.use(express.json({ limit: config.jsonLimitBytes }));
  api.use(
    session({
      name: SESSION_COOKIE,
      store,
      secret,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'strict', secure: config.cookieSecure, maxAge: config.sessionMaxAgeMs, path: '/' },
    }),
  );
  // No passport.initialize(): since passport 0.5.1 authenticate() (here the session strategy) gives the request
  // login/logout itself, and initialize's compatibility fields would only cost time on every request.
  api.use(passport.session());
  api.use(sameOriginOnly(config.allowedOrigins));
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', NO_STORE);
    next();
  });

  const table = new RouteTable(api);
  table.add('get', '/api/health', 'public', (_req, res) => {
    res.json({ ok: true });
  });
  accountsRoutes(table, {
    accounts,
    passport,
    signInLimiters: signInLimiters(config.signIn),
    resetLimiter: resetLimiter(config.signIn),
    cookieSecure: config.cookieSecure,
  });
  budgetsRoutes(table, services.budgets, {
    importMaxBytes: config.importMaxBytes,
    limits: { trialsCap: config.trialsCap, defaultTrials: DEFAULTS.trials, timeoutSeconds: Math.round(config.computeTimeoutMs / 1000) },
  });
  reviewsRoutes(table, services.reviews);
  reportsRoutes(table, services.reports);
  uploadsRoutes(table, services.attachments, {
    observationsMaxBytes: config.observationsMaxBytes,
    attachmentMaxBytes: config.attachmentMaxBytes,
  });
  auditRoutes(table, services.audit);
  mailRoutes(table, mail);

  app.use(api);
  app.use('/api', apiNotFound);

  if (config.staticDir && existsSync(join(config.staticDir, 'index.html'))) app.use(staticClient(config.staticDir));
  app.use(errorHandler(config.log));

  let closed = false;
  return {
    app,
    config,
    connection,
    services,
    pool,
    routes: table.routes,
    async close() {
      if (closed) return;
      closed = true;
      store.close();
      await pool.close();
      await mail.close();
      connection.close();
    },
  };
}
