/**
 * Mark contracts. A mark is a note pinned to a frequency or a band [lo, hi] of a capture's spectrum
 * ("50 Hz mains", "servo bump"). Marks belong to the capture's frequency axis, so they survive
 * re-analysis and show on every analysis of the capture.
 *   GET    /api/captures/:captureId/marks   -> MarksResponse (any member of the capture's bench)
 *   POST   /api/captures/:captureId/marks   CreateMarkRequest -> 201 MarkResponse (owner, analyst)
 *   PATCH  /api/marks/:id                   UpdateMarkRequest -> MarkResponse (its author, or an owner)
 *   DELETE /api/marks/:id                   -> 204 (its author, or an owner)
 * A frequency or band edge must lie inside the spectrum's band: from the lowest frequency of the
 * capture's latest done analysis up to its Nyquist frequency (half the sample rate); otherwise 400
 * validation_failed naming the field and the band. 409 conflict while the capture has no done analysis.
 * Viewers get 403 forbidden on writes; members of other benches get 404 not_found for every id.
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';

export const MarkKind = z.enum(['spur', 'servo-bump', 'mains', 'relaxation-oscillation', 'other']);
export type MarkKind = z.infer<typeof MarkKind>;

export const MARK_KIND_LABELS: Record<MarkKind, string> = {
  spur: 'spur',
  'servo-bump': 'servo bump',
  mains: 'mains',
  'relaxation-oscillation': 'relaxation oscillation',
  other: 'other',
};

export const MARK_TEXT_MAX = 500;

const MarkText = z
  .string({ error: 'must be text' })
  .trim()
  .min(1, 'must not be empty')
  .max(MARK_TEXT_MAX, `must be at most ${MARK_TEXT_MAX} characters`);

const FrequencyHz = z.number({ error: 'must be a number of Hz' }).finite('must be finite').positive('must be positive');

/** [lo, hi] in Hz with lo < hi. */
export const MarkBandHz = z
  .tuple([FrequencyHz, FrequencyHz], { error: 'must be [lo, hi] in Hz' })
  .refine(([lo, hi]) => lo < hi, { message: 'the low edge must be below the high edge (lo < hi)', path: [1] });

const placeRule = (v: { frequencyHz?: number; bandHz?: readonly [number, number] }) =>
  !(v.frequencyHz !== undefined && v.bandHz !== undefined);

export const CreateMarkRequest = z
  .strictObject({
    kind: MarkKind,
    text: MarkText,
    /** a mark at one frequency, Hz … */
    frequencyHz: FrequencyHz.optional(),
    /** … or over a band [lo, hi], Hz */
    bandHz: MarkBandHz.optional(),
  })
  .refine(placeRule, { message: 'give frequencyHz or bandHz, not both', path: ['bandHz'] })
  .refine((v) => v.frequencyHz !== undefined || v.bandHz !== undefined, {
    message: 'give frequencyHz (one frequency) or bandHz ([lo, hi])',
    path: ['frequencyHz'],
  });
export type CreateMarkRequest = z.infer<typeof CreateMarkRequest>;

/** Any of the fields; giving frequencyHz turns a band mark into a one-frequency mark and vice versa. */
export const UpdateMarkRequest = z
  .strictObject({
    kind: MarkKind.optional(),
    text: MarkText.optional(),
    frequencyHz: FrequencyHz.optional(),
    bandHz: MarkBandHz.optional(),
  })
  .refine(placeRule, { message: 'give frequencyHz or bandHz, not both', path: ['bandHz'] })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'give at least one field to change', path: [] });
export type UpdateMarkRequest = z.infer<typeof UpdateMarkRequest>;

export const Mark = z.object({
  id: Id,
  captureId: Id,
  kind: MarkKind,
  text: z.string(),
  /** the frequency of a one-frequency mark, else null */
  frequencyHz: z.number().nullable(),
  /** the band of a band mark, else null */
  bandHz: z.tuple([z.number(), z.number()]).nullable(),
  authorId: Id.nullable(),
  authorName: z.string().nullable(),
  /** the caller may edit and delete it (its author, or an owner of the bench) */
  canEdit: z.boolean(),
  createdAt: Timestamp,
  updatedAt: Timestamp,
});
export type Mark = z.infer<typeof Mark>;

export const MarksResponse = z.object({
  /** lowest frequency first */
  marks: z.array(Mark),
  /** where marks may be placed: [lowest frequency, Nyquist] of the latest done analysis; null before one is done */
  bandHz: z.tuple([z.number(), z.number()]).nullable(),
});
export type MarksResponse = z.infer<typeof MarksResponse>;

export const MarkResponse = z.object({ mark: Mark });
export type MarkResponse = z.infer<typeof MarkResponse>;
