/**
 * The routes that send or show e-mail, built once for createApp():
 *  - `publicRoutes` (mount on /api): GET /outbox (not in production), /password-resets…,
 *    /invitations/preview and /accept, /notification-settings;
 *  - `benchInvitations` (mount on /api/benches/:benchId/invitations behind loadBenchAccess).
 */
import type { Router } from 'express';
import { Router as createRouter } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Env } from '../config/env';
import type { AuthRateLimits } from '../modules/auth/auth-rate-limits';
import type { AuthService } from '../modules/auth/auth.service';
import { benchInvitationsRouter, invitationLinksRouter } from '../modules/invitations/invitations.router';
import { createInvitationsService } from '../modules/invitations/invitations.service';
import { outboxRouter } from '../modules/outbox/outbox.router';
import { passwordResetsRouter } from '../modules/password-resets/password-resets.router';
import { createPasswordResetsService } from '../modules/password-resets/password-resets.service';
import { createSmtpMailer, publicBaseUrl, type Mailer } from './mailer';
import { notificationSettingsRouter } from './notifications/notifications.router';
import { createNotificationsService } from './notifications/notifications.service';
import { outboxDirOf } from './outbox-store';

export function createMailFeatures(deps: {
  db: Knex;
  env: Env;
  logger: Logger;
  auth: AuthService;
  rateLimits: AuthRateLimits;
  /** defaults to nodemailer over SMTP from the environment */
  mailer?: Mailer;
}): { publicRoutes: Router; benchInvitations: Router } {
  const { db, env, logger } = deps;
  const mailer = deps.mailer ?? createSmtpMailer(env);
  const baseUrl = publicBaseUrl(env);
  const invitations = createInvitationsService({ db, mailer, baseUrl, logger });
  const resets = createPasswordResetsService({ db, mailer, baseUrl, logger });
  const notifications = createNotificationsService({ db, mailer, baseUrl, logger });

  const publicRoutes = createRouter();
  publicRoutes.use(outboxRouter({ enabled: env.NODE_ENV !== 'production', dir: outboxDirOf(env) }));
  publicRoutes.use(passwordResetsRouter(resets, deps.rateLimits));
  publicRoutes.use(invitationLinksRouter(invitations, deps.auth));
  publicRoutes.use(notificationSettingsRouter(notifications));
  return { publicRoutes, benchInvitations: benchInvitationsRouter(invitations) };
}
