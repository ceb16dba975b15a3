/**
 * Laser contracts. A laser carries its nominal wavelength and optical frequency together: the
 * request gives one of them (or neither) and the server fills in the other with the exact speed of
 * light, ν[THz] = c / λ[nm] / 1000, c = 299 792 458 m/s.
 *   GET    /api/benches/:benchId/lasers                  -> LaserListResponse (any member)
 *   POST   /api/benches/:benchId/lasers   CreateLaserRequest -> 201 LaserResponse (owner, analyst)
 *   GET    /api/benches/:benchId/lasers/:laserId         -> LaserResponse (any member)
 *   PATCH  /api/benches/:benchId/lasers/:laserId UpdateLaserRequest -> LaserResponse (owner, analyst)
 *   DELETE /api/benches/:benchId/lasers/:laserId         -> 204 (owner, analyst)
 * Laser names are unique per bench (409 conflict).
 */
import { z } from 'zod';
import { DisplayName, FreeText, Id, Timestamp } from './common';

export const LaserType = z.enum(['dfb', 'dbr', 'external-cavity', 'fibre', 'vcsel', 'other']);
export type LaserType = z.infer<typeof LaserType>;

export const WavelengthNm = z.number().positive('must be positive').max(1e6, 'must be at most 1e6 nm');
export const FrequencyThz = z.number().positive('must be positive').max(1e6, 'must be at most 1e6 THz');

export const Laser = z.object({
  id: Id,
  benchId: Id,
  name: z.string(),
  type: LaserType,
  wavelengthNm: z.number().nullable(),
  frequencyThz: z.number().nullable(),
  notes: z.string().nullable(),
  createdAt: Timestamp,
  updatedAt: Timestamp,
});
export type Laser = z.infer<typeof Laser>;

export const LaserListResponse = z.object({ lasers: z.array(Laser) });
export type LaserListResponse = z.infer<typeof LaserListResponse>;

export const LaserResponse = z.object({ laser: Laser });
export type LaserResponse = z.infer<typeof LaserResponse>;

const ONE_UNIT_MESSAGE = 'give wavelengthNm or frequencyThz, not both';

/** Exactly one of wavelengthNm / frequencyThz, or neither. */
export const CreateLaserRequest = z
  .object({
    name: DisplayName,
    type: LaserType,
    wavelengthNm: WavelengthNm.optional(),
    frequencyThz: FrequencyThz.optional(),
    notes: FreeText(4000).optional(),
  })
  .refine((v) => v.wavelengthNm === undefined || v.frequencyThz === undefined, {
    message: ONE_UNIT_MESSAGE,
    path: ['frequencyThz'],
  });
export type CreateLaserRequest = z.input<typeof CreateLaserRequest>;

/**
 * PATCH: any subset. Giving wavelengthNm (or frequencyThz) sets both; `null` for either clears both;
 * giving both numbers is refused. `notes: null` or "" clears the notes.
 */
export const UpdateLaserRequest = z
  .object({
    name: DisplayName.optional(),
    type: LaserType.optional(),
    wavelengthNm: WavelengthNm.nullable().optional(),
    frequencyThz: FrequencyThz.nullable().optional(),
    notes: FreeText(4000).nullable().optional(),
  })
  .refine((v) => v.wavelengthNm == null || v.frequencyThz == null, {
    message: ONE_UNIT_MESSAGE,
    path: ['frequencyThz'],
  });
export type UpdateLaserRequest = z.input<typeof UpdateLaserRequest>;
