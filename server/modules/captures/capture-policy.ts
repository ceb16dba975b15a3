/**
 * Who may do what with captures and analyses. Members read everything on their bench; owners and
 * analysts upload and analyse; a capture is deleted by an owner or by the analyst who uploaded it.
 * A capture or analysis id on a bench the caller is not a member of is answered 404, like an id that
 * does not exist (its existence is not revealed).
 */
import type { BenchRole } from '../../contracts/benches';
import { forbidden, notFound } from '../../errors';
import type { BenchAccess } from '../benches/bench-policy';

const EVERYONE: readonly BenchRole[] = ['owner', 'analyst', 'viewer'];
const WRITERS: readonly BenchRole[] = ['owner', 'analyst'];

export const CAPTURE_PERMISSIONS = {
  'captures.read': EVERYONE,
  'captures.write': WRITERS,
} as const satisfies Record<string, readonly BenchRole[]>;

export type CaptureAction = keyof typeof CAPTURE_PERMISSIONS;

export function assertCaptureAction(access: BenchAccess, action: CaptureAction): void {
  const roles = CAPTURE_PERMISSIONS[action] as readonly BenchRole[];
  if (!roles.includes(access.role)) {
    throw forbidden(`your role on this bench (${access.role}) does not allow this; it needs ${roles.join(' or ')}`);
  }
}

/** Owners delete any capture; analysts the captures they uploaded. */
export function assertMayDeleteCapture(access: BenchAccess, uploadedBy: string | null): void {
  if (access.role === 'owner') return;
  if (access.role === 'analyst' && uploadedBy === access.userId) return;
  throw forbidden(
    access.role === 'analyst'
      ? 'analysts delete only the captures they uploaded; ask an owner of the bench'
      : `your role on this bench (${access.role}) does not allow this; it needs owner, or the analyst who uploaded it`,
  );
}

export const CAPTURE_NOT_FOUND = 'no such capture, or it is not on a bench of yours';
export const ANALYSIS_NOT_FOUND = 'no such analysis, or it is not on a bench of yours';

const ID_PATTERN = /^[a-z2-7]{24}$/;

/** 404 for ids that cannot exist, before any query. */
export function assertIdShape(id: string, message: string): void {
  if (!ID_PATTERN.test(id)) throw notFound(message);
}

/** The caller's access to the bench of a row found with its membership join; 404 for non-members. */
export function accessFromRow(
  row: { bench_id: string; role: BenchRole | null } | undefined,
  userId: string,
  message: string,
): BenchAccess {
  if (!row || !row.role) throw notFound(message);
  return { benchId: row.bench_id, userId, role: row.role };
}
