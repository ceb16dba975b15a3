/**
 * createApp(deps): the Express application — API under /api and, when `clientDir` is given, the built
 * client with SPA fallback. Never listens (server/index.ts does). Dependencies are passed in.
 */
import express, { Router, type Express } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Env } from './config/env';
import { notFound } from './errors';
import { createMailFeatures } from './mail/mail-features';
import type { Mailer } from './mail/mailer';
import { loadBenchAccess } from './middleware/bench-access';
import { clientRoutes } from './middleware/client';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { originCheck } from './middleware/origin-check';
import { requestLogger } from './middleware/request-logger';
import { securityHeaders } from './middleware/security-headers';
import { requireUser, sessionMiddleware, unlessBearer } from './middleware/session';
import type { AuthRateLimits } from './modules/auth/auth-rate-limits';
import { createAnalysesRouter } from './modules/analyses/analyses.router';
import { createAnalysesService } from './modules/analyses/analyses.service';
import { apiTokensRouter } from './modules/api-tokens/api-tokens.router';
import { createApiTokensService } from './modules/api-tokens/api-tokens.service';
import { auditRouter } from './modules/audit/audit.router';
import { createAuditService } from './modules/audit/audit.service';
import { authRouter } from './modules/auth/auth.router';
import { benchesRouter } from './modules/benches/benches.router';
import { createCapturesRouter } from './modules/captures/captures.router';
import { createCapturesService } from './modules/captures/captures.service';
import { createCommentsRouter } from './modules/comments/comments.router';
import { createCommentsService } from './modules/comments/comments.service';
import { createLaserEstimatesRouter } from './modules/laser-estimates/laser-estimates.router';
import { lasersRouter } from './modules/lasers/lasers.router';
import { createLinkBudgetsRouter } from './modules/link-budgets/link-budgets.router';
import { createLinkBudgetsService } from './modules/link-budgets/link-budgets.service';
import { createMarksRouter } from './modules/marks/marks.router';
import { createMarksService } from './modules/marks/marks.service';
import { membersRouter } from './modules/members/members.router';
import { createOverlaysRouter } from './modules/overlays/overlays.router';
import { createOverlaysService } from './modules/overlays/overlays.service';
import { createVersionRouter } from './modules/reports/version.router';
import { createRfSpectraRouter } from './modules/rf-spectra/rf-spectra.router';
import { createRfSpectraService } from './modules/rf-spectra/rf-spectra.service';
import { createShareLinksRouter } from './modules/share-links/share-links.router';
import { createShareLinksService } from './modules/share-links/share-links.service';
import { createSharedRouter, type SharedRateLimit } from './modules/shared/shared.router';
import { createSharedService } from './modules/shared/shared.service';
import { createSweepsRouter } from './modules/sweeps/sweeps.router';
import { createSweepsService } from './modules/sweeps/sweeps.service';
import { createSimulationsRouter } from './modules/simulations/simulations.router';
import { createSimulationsService } from './modules/simulations/simulations.service';
import { openApiRouter } from './openapi/openapi.router';
import { createCorrectionsRouter } from './modules/corrections/corrections.router';
import { createCorrectionsService } from './modules/corrections/corrections.service';
import { createStabilityRouter } from './modules/stability/stability.router';
import { createStabilityService } from './modules/stability/stability.service';
import { createServices, type Services } from './services';
import { LocalDiskStorage } from './storage/local-disk-storage';
import type { Storage } from './storage/storage';

export interface AppDeps {
  db: Knex;
  env: Env;
  logger: Logger;
  /** Defaults to createServices(db). */
  services?: Services;
  /** Folder of the built client to serve with SPA fallback; omit for an API-only app. */
  clientDir?: string;
  /** Defaults from PHASELOOM_SIGNIN_RATE_LIMIT, PHASELOOM_SIGNUP_RATE_LIMIT, PHASELOOM_AUTH_RATE_WINDOW_MINUTES. */
  rateLimits?: AuthRateLimits;
  /** Where capture files and series live; defaults to the local disk under env.storageDir. */
  storage?: Storage;
  /** Told when analyses were queued (server/index.ts passes the job runner's poke). */
  onAnalysesQueued?: () => void;
  /** Sends e-mail; defaults to nodemailer over SMTP from the environment. */
  mailer?: Mailer;
  /** Mounts extra routes under /api after the app's own (tests use it to inject a failing route). */
  extraApiRoutes?: (api: Router) => void;
  /** Rate limit of GET /api/shared/* per client address; defaults to shared.router.ts's. */
  sharedRateLimit?: SharedRateLimit;
}

export function rateLimitsFromEnv(env: Env): AuthRateLimits {
  return {
    windowMs: env.PHASELOOM_AUTH_RATE_WINDOW_MINUTES * 60_000,
    signIn: { limit: env.PHASELOOM_SIGNIN_RATE_LIMIT },
    signUp: { limit: env.PHASELOOM_SIGNUP_RATE_LIMIT },
  };
}

export function createApp(deps: AppDeps): Express {
  const { env, logger } = deps;
  const services = deps.services ?? createServices(deps.db);
  const https = env.PHASELOOM_PUBLIC_URL?.startsWith('https:') ?? false;

  const app = express();
  app.disable('x-powered-by');
  // API replies are `no-store`; an ETag (a hash of every JSON body) would only cost time
  app.set('etag', false);
  app.set('trust proxy', env.PHASELOOM_TRUST_PROXY);

  app.use(requestLogger(logger));
  app.use(securityHeaders({ https }));

  const api = Router();
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // Bearer requests skip the Origin check: the session middleware then ignores their cookie.
  api.use(unlessBearer(originCheck({ publicUrl: env.PHASELOOM_PUBLIC_URL })));
  api.use(express.json({ limit: '1mb' }));
  const apiTokens = createApiTokensService(deps.db);
  api.use(sessionMiddleware(services.auth, apiTokens));

  api.use(openApiRouter());
  const rateLimits = deps.rateLimits ?? rateLimitsFromEnv(env);
  api.use(authRouter(services.auth, rateLimits));
  const mail = createMailFeatures({ db: deps.db, env, logger, auth: services.auth, rateLimits, mailer: deps.mailer });
  api.use(mail.publicRoutes);
  api.use('/me/tokens', requireUser, apiTokensRouter(apiTokens));
  api.use('/benches', requireUser);
  api.use('/benches/:benchId', loadBenchAccess(services.benches));
  api.use('/benches/:benchId/members', membersRouter(services.members));
  api.use('/benches/:benchId/lasers', lasersRouter(services.lasers));
  api.use('/benches/:benchId/audit', auditRouter(createAuditService(deps.db)));
  api.use('/benches/:benchId/invitations', mail.benchInvitations);
  api.use('/benches', benchesRouter(services.benches));
  const storage = deps.storage ?? new LocalDiskStorage(env.storageDir);
  const queued = { db: deps.db, storage, lasers: services.lasers, onQueued: deps.onAnalysesQueued };
  const captures = createCapturesService({ ...queued, logger });
  api.use(createCapturesRouter({ captures, storage, maxUploadBytes: env.PHASELOOM_MAX_UPLOAD_BYTES }));
  api.use(createAnalysesRouter({ analyses: createAnalysesService(queued) }));
  api.use(createLinkBudgetsRouter(createLinkBudgetsService({ db: deps.db, storage })));
  api.use(createLaserEstimatesRouter());
  api.use(createSimulationsRouter(createSimulationsService({ db: deps.db, storage, captures, lasers: services.lasers, logger })));
  api.use(createRfSpectraRouter(createRfSpectraService(deps.db)));
  api.use(createStabilityRouter(createStabilityService({ db: deps.db, storage })));
  api.use(createCorrectionsRouter(createCorrectionsService({ db: deps.db, storage })));
  api.use(createMarksRouter({ marks: createMarksService({ db: deps.db }) }));
  api.use(createCommentsRouter({ comments: createCommentsService({ db: deps.db }) }));
  api.use(createVersionRouter());
  const overlays = createOverlaysService(deps.db);
  api.use(createOverlaysRouter({ overlays }));
  api.use(createSweepsRouter({ sweeps: createSweepsService({ db: deps.db, lasers: services.lasers }) }));
  const shareLinks = createShareLinksService({ db: deps.db, overlays });
  api.use(createShareLinksRouter({ shareLinks, publicUrl: env.PHASELOOM_PUBLIC_URL }));
  api.use(createSharedRouter({ shared: createSharedService(deps.db), rateLimit: deps.sharedRateLimit }));
  deps.extraApiRoutes?.(api);
  api.use(apiNotFound);

  app.use('/api', api);
  if (deps.clientDir) app.use(clientRoutes(deps.clientDir));
  app.use((req, _res, next) => next(notFound(`nothing at ${req.method} ${req.originalUrl.split('?')[0]}`)));
  app.use(errorHandler(logger));
  return app;
}
