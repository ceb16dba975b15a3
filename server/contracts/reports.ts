/**
 * Report contracts.
 *   GET /api/version -> VersionResponse (public): the product name and version from package.json,
 *   printed in the provenance of every report.
 */
import { z } from 'zod';

export const VersionResponse = z.object({ name: z.string(), version: z.string() });
export type VersionResponse = z.infer<typeof VersionResponse>;
