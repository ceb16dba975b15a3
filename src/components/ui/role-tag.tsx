import type { BenchRole } from '../../../server/contracts/benches';
import { cn } from './cn';

const LABELS: Record<BenchRole, string> = { owner: 'owner', analyst: 'analyst', viewer: 'viewer' };

/** A bench role as a small ruled tag: owner · analyst · viewer. */
export function RoleTag({ role, className }: { role: BenchRole; className?: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center rounded-full border px-2 py-px text-xs font-medium tracking-wide',
        role === 'owner' && 'border-accent/40 bg-accent-soft/60 text-accent',
        role === 'analyst' && 'border-ok/35 bg-ok-soft/60 text-ok',
        role === 'viewer' && 'border-rule-strong text-ink-soft',
        className,
      )}
    >
      {LABELS[role]}
    </span>
  );
}

/** What each role may do, as one sentence. */
export const ROLE_DESCRIPTIONS: Record<BenchRole, string> = {
  owner: 'Owners manage members, edit and delete the bench, and do everything analysts do.',
  analyst: 'Analysts add and edit lasers, upload and analyse captures.',
  viewer: 'Viewers read everything on the bench and change nothing.',
};
