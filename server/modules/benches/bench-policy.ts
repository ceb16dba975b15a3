/**
 * Who may do what on a bench. One table; routes check it before parsing the body (so a refused
 * member learns nothing about validation), services check it again before writing.
 */
import type { BenchRole } from '../../contracts/benches';
import { forbidden } from '../../errors';

const EVERYONE: readonly BenchRole[] = ['owner', 'analyst', 'viewer'];
const WRITERS: readonly BenchRole[] = ['owner', 'analyst'];
const OWNERS: readonly BenchRole[] = ['owner'];

export const BENCH_PERMISSIONS = {
  'bench.read': EVERYONE,
  'bench.update': OWNERS,
  'bench.delete': OWNERS,
  'members.read': EVERYONE,
  'members.manage': OWNERS,
  'lasers.read': EVERYONE,
  'lasers.write': WRITERS,
} as const satisfies Record<string, readonly BenchRole[]>;

export type BenchAction = keyof typeof BENCH_PERMISSIONS;

/** The caller's membership of one bench, loaded on the server for every bench-scoped request. */
export interface BenchAccess {
  benchId: string;
  userId: string;
  role: BenchRole;
}

export function can(access: BenchAccess, action: BenchAction): boolean {
  return (BENCH_PERMISSIONS[action] as readonly BenchRole[]).includes(access.role);
}

/** Throws 403 `forbidden` when the caller's role does not allow the action. */
export function assertCan(access: BenchAccess, action: BenchAction): void {
  if (!can(access, action)) {
    const roles = BENCH_PERMISSIONS[action].join(' or ');
    throw forbidden(`your role on this bench (${access.role}) does not allow this; it needs ${roles}`);
  }
}
