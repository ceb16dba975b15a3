/**
 * Who may change a mark or a comment: owners and analysts add them; their author (while still an
 * owner or analyst of the bench) or any owner edits and deletes them; viewers only read.
 */
import { forbidden } from '../../errors';
import type { BenchAccess } from '../benches/bench-policy';

export function mayChangeNote(access: BenchAccess, authorId: string | null): boolean {
  if (access.role === 'owner') return true;
  return access.role === 'analyst' && authorId !== null && authorId === access.userId;
}

/** 403 unless the caller is the note's author (an analyst) or an owner; `what` is "marks" or "comments". */
export function assertMayChangeNote(access: BenchAccess, authorId: string | null, what: string, verb: string): void {
  if (mayChangeNote(access, authorId)) return;
  throw forbidden(
    access.role === 'analyst'
      ? `analysts ${verb} only the ${what} they wrote; ask an owner of the bench`
      : `your role on this bench (${access.role}) does not allow this; it needs owner, or the analyst who wrote it`,
  );
}
