/**
 * Invitations: the bench side (/api/benches/:benchId/invitations, owner; mounted behind requireUser
 * and loadBenchAccess) and the link side (/api/invitations/preview and /accept, no sign-in needed).
 */
import { Router } from 'express';
import {
  AcceptInvitationRequest,
  CreateInvitationRequest,
  InvitationTokenRequest,
  type AcceptInvitationResponse,
  type InvitationListResponse,
  type InvitationPreviewResponse,
  type InvitationResponse,
} from '../../contracts/invitations';
import { allow, benchAccessOf } from '../../middleware/bench-access';
import { authOf } from '../../middleware/session';
import type { AuthService } from '../auth/auth.service';
import { setSessionCookie } from '../auth/session-cookie';
import type { InvitationsService } from './invitations.service';

export function benchInvitationsRouter(invitations: InvitationsService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', allow('members.manage'), async (_req, res) => {
    res.json({ invitations: await invitations.list(benchAccessOf(res)) } satisfies InvitationListResponse);
  });

  router.post('/', allow('members.manage'), async (req, res) => {
    const input = CreateInvitationRequest.parse(req.body);
    const created = await invitations.create(benchAccessOf(res), input);
    res.status(201).json(created satisfies InvitationResponse);
  });

  return router;
}

export function invitationLinksRouter(invitations: InvitationsService, auth: AuthService): Router {
  const router = Router();

  router.post('/invitations/preview', async (req, res) => {
    const { token } = InvitationTokenRequest.parse(req.body);
    res.json({ invitation: await invitations.preview(token) } satisfies InvitationPreviewResponse);
  });

  router.post('/invitations/accept', async (req, res) => {
    const input = AcceptInvitationRequest.parse(req.body);
    const result = await invitations.accept(input, authOf(res)?.user ?? null);
    if (result.accountCreated) {
      const session = await auth.lucia.createSession(result.user.id, {});
      setSessionCookie(req, res, session);
    }
    res.json(result satisfies AcceptInvitationResponse);
  });

  return router;
}
