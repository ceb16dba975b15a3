/**
 * Invitations by e-mail. An owner invites an address with a role; the e-mail carries a single-use link
 * (/invitation/<token>) valid for 7 days. The token travels in request bodies, never in API URLs.
 *   POST /api/benches/:benchId/invitations  CreateInvitationRequest -> 201 InvitationResponse (owner)
 *   GET  /api/benches/:benchId/invitations                          -> InvitationListResponse (owner)
 *   POST /api/invitations/preview   InvitationTokenRequest          -> InvitationPreviewResponse (no sign-in)
 *   POST /api/invitations/accept    AcceptInvitationRequest         -> AcceptInvitationResponse
 *        signed in as the invited address: adds the membership;
 *        not signed in, no account yet: `name` + `password` create the account (and sign in);
 *        not signed in, account exists: 409 (sign in first, then accept).
 * Unknown token: 404 not_found. Used or expired: 410 gone, and nothing changes.
 */
import { z } from 'zod';
import { Email, PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, User } from './auth';
import { BenchRole } from './benches';
import { DisplayName, Id, Timestamp } from './common';

export const INVITATION_VALID_DAYS = 7;

export const CreateInvitationRequest = z.object({ email: Email, role: BenchRole });
export type CreateInvitationRequest = z.input<typeof CreateInvitationRequest>;

export const InvitationStatus = z.enum(['pending', 'accepted', 'expired']);
export type InvitationStatus = z.infer<typeof InvitationStatus>;

export const Invitation = z.object({
  id: Id,
  email: z.string(),
  role: BenchRole,
  status: InvitationStatus,
  invitedBy: z.object({ name: z.string(), email: z.string() }).nullable(),
  createdAt: Timestamp,
  expiresAt: Timestamp,
  acceptedAt: Timestamp.nullable(),
});
export type Invitation = z.infer<typeof Invitation>;

export const InvitationResponse = z.object({
  invitation: Invitation,
  /** false when the mail server refused the message (the invitation stands; invite again to resend) */
  emailSent: z.boolean(),
});
export type InvitationResponse = z.infer<typeof InvitationResponse>;

export const InvitationListResponse = z.object({ invitations: z.array(Invitation) });
export type InvitationListResponse = z.infer<typeof InvitationListResponse>;

export const InvitationToken = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'not an invitation token');

export const InvitationTokenRequest = z.object({ token: InvitationToken });
export type InvitationTokenRequest = z.input<typeof InvitationTokenRequest>;

export const InvitationPreview = z.object({
  benchName: z.string(),
  email: z.string(),
  role: BenchRole,
  invitedBy: z.string().nullable(),
  expiresAt: Timestamp,
  /** an account with the invited address exists: sign in to accept */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof InvitationPreview>;

export const InvitationPreviewResponse = z.object({ invitation: InvitationPreview });
export type InvitationPreviewResponse = z.infer<typeof InvitationPreviewResponse>;

export const AcceptInvitationRequest = z.object({
  token: InvitationToken,
  name: DisplayName.optional(),
  password: z
    .string()
    .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
    .max(PASSWORD_MAX_LENGTH, `must be at most ${PASSWORD_MAX_LENGTH} characters`)
    .optional(),
});
export type AcceptInvitationRequest = z.input<typeof AcceptInvitationRequest>;

export const AcceptInvitationResponse = z.object({ benchId: Id, user: User, accountCreated: z.boolean() });
export type AcceptInvitationResponse = z.infer<typeof AcceptInvitationResponse>;
