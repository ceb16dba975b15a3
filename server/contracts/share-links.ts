/**
 * Share-link contracts. A share link is a read-only link to one spectrum (analysis) or one overlay,
 * for people outside the bench; it may expire and can be revoked.
 *   POST   /api/analyses/:id/share-links  CreateShareLinkRequest -> 201 CreateShareLinkResponse (owner, analyst)
 *   POST   /api/overlays/:id/share-links  CreateShareLinkRequest -> 201 CreateShareLinkResponse (owner, analyst)
 *   DELETE /api/share-links/:id                                  -> 204 (owner, analyst)
 *   GET    /api/benches/:benchId/share-links                     -> ShareLinkListResponse (owner, analyst; never tokens)
 *   GET    /api/shared/:token   (no sign-in)                     -> SharedResponse; 404 unknown, 410 revoked or expired
 * Viewers get 403, members of other benches 404. The token (32 random bytes, base64url: 256 bits) is
 * in `url` once; the server keeps only its sha256.
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';
import { DisplaySeries, OperatingPoint, TraceFigures, TraceSettings } from './overlays';

export const CreateShareLinkRequest = z.strictObject({
  /** when the link stops working; must be in the future. Without it the link lasts until revoked. */
  expiresAt: Timestamp.refine((v) => Date.parse(v) > Date.now(), 'must be in the future').optional(),
});
export type CreateShareLinkRequest = z.input<typeof CreateShareLinkRequest>;

export const CreateShareLinkResponse = z.object({
  id: Id,
  /** the public page, token included: shown this once */
  url: z.string(),
});
export type CreateShareLinkResponse = z.infer<typeof CreateShareLinkResponse>;

export const ShareTargetKind = z.enum(['analysis', 'overlay']);
export type ShareTargetKind = z.infer<typeof ShareTargetKind>;

export const ShareLinkState = z.enum(['active', 'expired', 'revoked']);
export type ShareLinkState = z.infer<typeof ShareLinkState>;

export const ShareLink = z.object({
  id: Id,
  kind: ShareTargetKind,
  targetId: Id,
  /** the capture's file name or the overlay's name */
  targetLabel: z.string(),
  createdByName: z.string().nullable(),
  createdAt: Timestamp,
  expiresAt: Timestamp.nullable(),
  revokedAt: Timestamp.nullable(),
  state: ShareLinkState,
});
export type ShareLink = z.infer<typeof ShareLink>;

export const ShareLinkListResponse = z.object({ shareLinks: z.array(ShareLink) });
export type ShareLinkListResponse = z.infer<typeof ShareLinkListResponse>;

/** Where a shared spectrum came from: the capture file and how it was analysed. */
export const SharedProvenance = z.object({
  fileName: z.string(),
  sha256: z.string(),
  kind: z.string(),
  format: z.string(),
  sampleRateHz: z.number().nullable(),
  capturedAt: Timestamp,
  analysedAt: Timestamp.nullable(),
  laserName: z.string().nullable(),
  operatingPoint: OperatingPoint,
});
export type SharedProvenance = z.infer<typeof SharedProvenance>;

/** A mark on the shared spectrum: a frequency or a band with a kind and a text. */
export const SharedMark = z.object({
  kind: z.string(),
  text: z.string(),
  frequencyHz: z.number().nullable(),
  bandHz: z.tuple([z.number(), z.number()]).nullable(),
});
export type SharedMark = z.infer<typeof SharedMark>;

export const SharedTrace = z.object({
  color: z.string(),
  label: z.string(),
  figures: TraceFigures,
  settings: TraceSettings,
  provenance: SharedProvenance,
  series: DisplaySeries.nullable(),
  marks: z.array(SharedMark),
});
export type SharedTrace = z.infer<typeof SharedTrace>;

/** GET /api/shared/:token — only what the page shows; nothing else of the bench. */
export const SharedResponse = z.object({
  kind: ShareTargetKind,
  title: z.string(),
  expiresAt: Timestamp.nullable(),
  traces: z.array(SharedTrace),
});
export type SharedResponse = z.infer<typeof SharedResponse>;

/** The 410 answer's error code (revoked or expired link). */
export const SHARE_GONE_CODE = 'gone';
