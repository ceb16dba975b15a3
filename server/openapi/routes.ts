/**
 * The registry of every /api route: method and path, who may call it, what it does, and the contract
 * schemas of its query, body and reply. The OpenAPI document (document.ts) and the README's routes
 * table are made from this list; tests/api/openapi.test.ts fails when the app answers a route that
 * is missing here, or this lists one the app does not answer.
 *
 * Adding a route: one entry, e.g.
 *   { route: 'GET /api/benches/:benchId/things', who: 'any member', what: 'list things', reply: ThingListResponse },
 * Path parameters come from the path; a POST with a reply answers 201, a route without one 204.
 */
import { z } from 'zod';
import {
  AnalysisResponse,
  Analysis,
  CreateAnalysisRequest,
  LaserSpectraResponse,
  SpectrumQuery,
  SpectrumResponse,
} from '../contracts/analyses';
import { ApiTokenListResponse, CreateApiTokenRequest, CreatedApiTokenResponse } from '../contracts/api-tokens';
import { AuditListQuery, AuditListResponse } from '../contracts/audit';
import { SignInRequest, SignUpRequest, UserResponse } from '../contracts/auth';
import {
  AddMemberRequest,
  BenchListResponse,
  BenchResponse,
  CreateBenchRequest,
  MemberListResponse,
  MemberResponse,
  UpdateBenchRequest,
  UpdateMemberRequest,
} from '../contracts/benches';
import {
  CaptureDetailResponse,
  CaptureListQuery,
  CaptureListResponse,
  CaptureUploadFields,
  CreateCaptureResponse,
} from '../contracts/captures';
import { CommentResponse, CommentsResponse, CreateCommentRequest } from '../contracts/comments';
import { CorrectionListResponse, CorrectionResponse, CreateCorrectionRequest } from '../contracts/corrections';
import {
  AcceptInvitationRequest,
  AcceptInvitationResponse,
  CreateInvitationRequest,
  InvitationListResponse,
  InvitationPreviewResponse,
  InvitationResponse,
  InvitationTokenRequest,
} from '../contracts/invitations';
import { LaserEstimateRequest, LaserEstimateResponse } from '../contracts/laser-estimates';
import { CreateLaserRequest, LaserListResponse, LaserResponse, UpdateLaserRequest } from '../contracts/lasers';
import {
  EvaluateLinkBudgetRequest,
  LinkBudgetEvaluation,
  LinkBudgetListResponse,
  LinkBudgetResponse,
  SaveLinkBudgetRequest,
} from '../contracts/link-budgets';
import { CreateMarkRequest, MarkResponse, MarksResponse, UpdateMarkRequest } from '../contracts/marks';
import { NotificationSettings, NotificationSettingsResponse } from '../contracts/notifications';
import { OutboxListQuery, OutboxListResponse } from '../contracts/outbox';
import { CreateOverlayRequest, OverlayListResponse, OverlayResponse, UpdateOverlayRequest } from '../contracts/overlays';
import {
  PasswordResetCheckResponse,
  PasswordResetConfirmRequest,
  PasswordResetRequest,
  PasswordResetRequestedResponse,
  PasswordResetTokenRequest,
} from '../contracts/password-resets';
import { VersionResponse } from '../contracts/reports';
import { RfSpectrumListResponse, RfSpectrumResponse, RfSpectrumUploadFields } from '../contracts/rf-spectra';
import {
  CreateShareLinkRequest,
  CreateShareLinkResponse,
  ShareLinkListResponse,
  SharedResponse,
} from '../contracts/share-links';
import { CreateSimulationRequest, SimulationListResponse, SimulationResponse } from '../contracts/simulations';
import { AllanResponse } from '../contracts/stability';
import { SweepQuery, SweepResponse } from '../contracts/sweeps';
import type { RouteSpec } from './route-spec';

/** The OpenAPI document itself (GET /api/openapi.json): described loosely, it describes itself. */
const OpenApiDocument = z.looseObject({ openapi: z.string(), info: z.looseObject({}), paths: z.looseObject({}) });

export const ROUTES: RouteSpec[] = [
  // ---- the API itself, accounts and sessions ------------------------------------------------------
  { route: 'GET /api/openapi.json', who: 'anyone', public: true, what: 'this API described as OpenAPI 3.1', reply: OpenApiDocument },
  { route: 'GET /api/version', who: 'anyone', public: true, what: 'product name and version', reply: VersionResponse },
  { route: 'POST /api/auth/sign-up', who: 'anyone', public: true, what: 'make an account and sign in (session cookie)', body: SignUpRequest, reply: UserResponse, errors: [409, 429] },
  { route: 'POST /api/auth/sign-in', who: 'anyone', public: true, what: 'sign in (session cookie)', body: SignInRequest, reply: UserResponse, status: 200, errors: [429] },
  { route: 'POST /api/auth/sign-out', who: 'anyone', public: true, what: 'end this session, clear the cookie' },
  { route: 'GET /api/me', who: 'signed in', what: 'the signed-in account', reply: UserResponse },
  { route: 'POST /api/password-resets', who: 'anyone', public: true, what: 'e-mail a password-reset link (same answer for any address)', body: PasswordResetRequest, reply: PasswordResetRequestedResponse, status: 202, errors: [429] },
  { route: 'POST /api/password-resets/check', who: 'anyone with the link', public: true, what: 'is this reset link still good?', body: PasswordResetTokenRequest, reply: PasswordResetCheckResponse, status: 200, errors: [404, 410] },
  { route: 'POST /api/password-resets/confirm', who: 'anyone with the link', public: true, what: 'choose the new password (ends other sessions)', body: PasswordResetConfirmRequest, errors: [404, 410] },
  { route: 'GET /api/notification-settings', who: 'signed in', what: 'my e-mail notices', reply: NotificationSettingsResponse },
  { route: 'PUT /api/notification-settings', who: 'signed in', what: 'turn e-mail notices on or off', body: NotificationSettings, reply: NotificationSettingsResponse },
  { route: 'GET /api/outbox', who: 'anyone (development and test only; absent in production)', public: true, what: 'e-mail kept by the local mail catcher', query: OutboxListQuery, reply: OutboxListResponse },
  { route: 'GET /api/me/tokens', who: 'signed in', what: 'my personal API tokens (never their secrets)', reply: ApiTokenListResponse },
  { route: 'POST /api/me/tokens', who: 'signed in (session only)', what: 'make a personal API token; the secret is in this reply only', body: CreateApiTokenRequest, reply: CreatedApiTokenResponse },
  { route: 'DELETE /api/me/tokens/:id', who: 'signed in (its owner)', what: 'revoke a personal API token' },

  // ---- benches, members, lasers -------------------------------------------------------------------
  { route: 'GET /api/benches', who: 'signed in', what: 'the benches I belong to, with my role', reply: BenchListResponse },
  { route: 'POST /api/benches', who: 'signed in', what: 'make a bench (you become its owner)', body: CreateBenchRequest, reply: BenchResponse, errors: [409] },
  { route: 'GET /api/benches/:benchId', who: 'any member', what: 'one bench', reply: BenchResponse },
  { route: 'PATCH /api/benches/:benchId', who: 'owner', what: 'rename or describe a bench', body: UpdateBenchRequest, reply: BenchResponse, errors: [409] },
  { route: 'DELETE /api/benches/:benchId', who: 'owner', what: 'delete a bench with everything on it' },
  { route: 'GET /api/benches/:benchId/members', who: 'any member', what: 'members and their roles', reply: MemberListResponse },
  { route: 'POST /api/benches/:benchId/members', who: 'owner', what: 'add an existing account with a role', body: AddMemberRequest, reply: MemberResponse, errors: [409] },
  { route: 'PATCH /api/benches/:benchId/members/:userId', who: 'owner', what: 'change a member’s role', body: UpdateMemberRequest, reply: MemberResponse, errors: [409] },
  { route: 'DELETE /api/benches/:benchId/members/:userId', who: 'owner, or the member themselves', what: 'remove a member / leave the bench', errors: [409] },
  { route: 'GET /api/benches/:benchId/invitations', who: 'owner', what: 'invitations sent for this bench', reply: InvitationListResponse },
  { route: 'POST /api/benches/:benchId/invitations', who: 'owner', what: 'invite an e-mail address with a role (single-use link, 7 days)', body: CreateInvitationRequest, reply: InvitationResponse, errors: [409] },
  { route: 'POST /api/invitations/preview', who: 'anyone with the link', public: true, what: 'the bench and role an invitation offers', body: InvitationTokenRequest, reply: InvitationPreviewResponse, status: 200, errors: [404, 410] },
  { route: 'POST /api/invitations/accept', who: 'anyone with the link (signed in as the invited address, or making the account)', public: true, what: 'accept: join the bench, making the account if needed', body: AcceptInvitationRequest, reply: AcceptInvitationResponse, status: 200, errors: [404, 409, 410] },
  { route: 'GET /api/benches/:benchId/lasers', who: 'any member', what: 'the bench’s lasers', reply: LaserListResponse },
  { route: 'POST /api/benches/:benchId/lasers', who: 'owner, analyst', what: 'add a laser', body: CreateLaserRequest, reply: LaserResponse, errors: [409] },
  { route: 'GET /api/benches/:benchId/lasers/:laserId', who: 'any member', what: 'one laser', reply: LaserResponse },
  { route: 'PATCH /api/benches/:benchId/lasers/:laserId', who: 'owner, analyst', what: 'edit a laser', body: UpdateLaserRequest, reply: LaserResponse, errors: [409] },
  { route: 'DELETE /api/benches/:benchId/lasers/:laserId', who: 'owner, analyst', what: 'delete a laser (its captures stay)' },
  { route: 'GET /api/benches/:benchId/lasers/:laserId/spectra', who: 'any member', what: 'a laser’s analysed captures over time', reply: LaserSpectraResponse },
  { route: 'GET /api/benches/:benchId/lasers/:laserId/sweep', who: 'any member', what: 'linewidths against an operating parameter (1/P fit for output power)', query: SweepQuery, reply: SweepResponse },

  // ---- captures and analyses ----------------------------------------------------------------------
  { route: 'POST /api/benches/:benchId/captures', who: 'owner, analyst', what: 'upload a capture (multipart); its first analysis is queued', multipart: CaptureUploadFields, reply: CreateCaptureResponse, errors: [413] },
  { route: 'GET /api/benches/:benchId/captures', who: 'any member', what: 'captures with filters and pages', query: CaptureListQuery, reply: CaptureListResponse },
  { route: 'GET /api/captures/:id', who: 'any member', what: 'one capture with its analyses', reply: CaptureDetailResponse },
  { route: 'DELETE /api/captures/:id', who: 'owner, or the analyst who uploaded it', what: 'delete a capture, its file and analyses' },
  { route: 'POST /api/captures/:id/analyses', who: 'owner, analyst', what: 'analyse again with other settings', body: CreateAnalysisRequest, reply: AnalysisResponse },
  { route: 'GET /api/analyses/:id', who: 'any member', what: 'status, progress, settings and figures (poll while queued/running)', reply: Analysis },
  { route: 'GET /api/analyses/:id/spectrum', who: 'any member', what: 'a log-binned view of the spectrum', query: SpectrumQuery, reply: SpectrumResponse },
  { route: 'GET /api/analyses/:id/series.csv', who: 'any member', what: 'the full spectrum as CSV', replyType: 'text/csv' },
  { route: 'GET /api/analyses/:id/allan', who: 'any member', what: 'overlapping Allan deviation of the capture’s frequency, with confidence intervals', reply: AllanResponse, errors: [409] },
  { route: 'POST /api/analyses/:id/corrections', who: 'owner, analyst', what: 'correct a spectrum (reference laser subtracted, or delay-interferometer transfer divided) and read its figures again', body: CreateCorrectionRequest, reply: CorrectionResponse },
  { route: 'GET /api/analyses/:id/corrections', who: 'any member', what: 'the corrections made from an analysis', reply: CorrectionListResponse },
  { route: 'GET /api/corrections/:id', who: 'any member', what: 'one correction with its figures', reply: CorrectionResponse },
  { route: 'DELETE /api/corrections/:id', who: 'owner, analyst', what: 'delete a correction' },
  { route: 'POST /api/analyses/:id/retry', who: 'owner, analyst', what: 'queue a failed analysis again', reply: AnalysisResponse, status: 200, errors: [409] },

  // ---- marks and comments -------------------------------------------------------------------------
  { route: 'GET /api/captures/:captureId/marks', who: 'any member', what: 'marks on a capture’s spectrum', reply: MarksResponse },
  { route: 'POST /api/captures/:captureId/marks', who: 'owner, analyst', what: 'mark a frequency or a band', body: CreateMarkRequest, reply: MarkResponse, errors: [409] },
  { route: 'PATCH /api/marks/:id', who: 'its author, or an owner', what: 'edit a mark', body: UpdateMarkRequest, reply: MarkResponse },
  { route: 'DELETE /api/marks/:id', who: 'its author, or an owner', what: 'delete a mark' },
  { route: 'GET /api/captures/:captureId/comments', who: 'any member', what: 'the comment thread of a spectrum', reply: CommentsResponse },
  { route: 'POST /api/captures/:captureId/comments', who: 'owner, analyst', what: 'add a comment', body: CreateCommentRequest, reply: CommentResponse },
  { route: 'DELETE /api/comments/:id', who: 'its author, or an owner', what: 'delete a comment' },

  // ---- overlays, share links ----------------------------------------------------------------------
  { route: 'GET /api/benches/:benchId/overlays', who: 'any member', what: 'saved overlays', reply: OverlayListResponse },
  { route: 'POST /api/benches/:benchId/overlays', who: 'owner, analyst', what: 'save an overlay of spectra', body: CreateOverlayRequest, reply: OverlayResponse },
  { route: 'GET /api/overlays/:id', who: 'any member', what: 'one overlay with its traces and figures', reply: OverlayResponse },
  { route: 'PATCH /api/overlays/:id', who: 'owner, analyst', what: 'rename an overlay or change its traces', body: UpdateOverlayRequest, reply: OverlayResponse },
  { route: 'DELETE /api/overlays/:id', who: 'owner, analyst', what: 'delete an overlay' },
  { route: 'POST /api/analyses/:id/share-links', who: 'owner, analyst', what: 'a read-only link to a spectrum', body: CreateShareLinkRequest, reply: CreateShareLinkResponse },
  { route: 'POST /api/overlays/:id/share-links', who: 'owner, analyst', what: 'a read-only link to an overlay', body: CreateShareLinkRequest, reply: CreateShareLinkResponse },
  { route: 'GET /api/benches/:benchId/share-links', who: 'owner, analyst', what: 'the bench’s share links (never their tokens)', reply: ShareLinkListResponse },
  { route: 'DELETE /api/share-links/:id', who: 'owner, analyst', what: 'revoke a share link' },
  { route: 'GET /api/shared/:token', who: 'anyone with the link', public: true, what: 'the shared figures, plot data and marks', reply: SharedResponse, errors: [410] },

  // ---- RF spectra, audit --------------------------------------------------------------------------
  { route: 'POST /api/benches/:benchId/rf-spectra', who: 'owner, analyst', what: 'upload an RF beat spectrum (multipart CSV); fitted on receipt', multipart: RfSpectrumUploadFields, reply: RfSpectrumResponse, errors: [413] },
  { route: 'GET /api/benches/:benchId/rf-spectra', who: 'any member', what: 'RF spectra of the bench (no traces)', reply: RfSpectrumListResponse },
  { route: 'GET /api/rf-spectra/:id', who: 'any member', what: 'one RF spectrum with its trace and fits', reply: RfSpectrumResponse },
  { route: 'DELETE /api/rf-spectra/:id', who: 'owner, or the analyst who uploaded it', what: 'delete an RF spectrum' },
  { route: 'GET /api/benches/:benchId/audit', who: 'owner', what: 'the audit trail, with filters', query: AuditListQuery, reply: AuditListResponse },

  // ---- laser physics: estimates, link budgets, simulations ----------------------------------------
  { route: 'POST /api/laser-estimates', who: 'signed in', what: 'the linewidth a laser design predicts (nothing stored)', body: LaserEstimateRequest, reply: LaserEstimateResponse, status: 200 },
  { route: 'POST /api/link-budgets/evaluate', who: 'signed in (analyses read through your benches)', what: 'check a modulation format’s phase-noise tolerance (nothing stored)', body: EvaluateLinkBudgetRequest, reply: LinkBudgetEvaluation, status: 200, errors: [404] },
  { route: 'GET /api/benches/:benchId/link-budgets', who: 'any member', what: 'saved link budgets', reply: LinkBudgetListResponse },
  { route: 'POST /api/benches/:benchId/link-budgets', who: 'owner, analyst', what: 'save a link budget', body: SaveLinkBudgetRequest, reply: LinkBudgetResponse },
  { route: 'GET /api/link-budgets/:id', who: 'any member', what: 'one saved link budget', reply: LinkBudgetResponse },
  { route: 'DELETE /api/link-budgets/:id', who: 'owner, or the analyst who saved it', what: 'delete a link budget' },
  { route: 'POST /api/benches/:benchId/simulations', who: 'owner, analyst', what: 'simulate a laser; the result becomes a synthetic capture', body: CreateSimulationRequest, reply: SimulationResponse, status: 202 },
  { route: 'GET /api/benches/:benchId/simulations', who: 'any member', what: 'the bench’s simulations', reply: SimulationListResponse },
  { route: 'GET /api/simulations/:id', who: 'any member', what: 'one simulation with its status and prediction', reply: SimulationResponse },
];
