import { Link } from 'react-router';
import type { BenchSummary } from '../../../../server/contracts/benches';
import { Mono } from '../../../components/ui/quantity';
import { RoleTag } from '../../../components/ui/role-tag';
import { formatIsoDate } from '../../../lib/dates';

export interface BenchListProps {
  benches: BenchSummary[];
  hrefFor: (benchId: string) => string;
}

/** The benches a person belongs to, as ruled entries of a notebook's contents page. */
export function BenchList({ benches, hrefFor }: BenchListProps) {
  return (
    <ol className="divide-y divide-rule border-b border-rule" aria-label="Your benches">
      {benches.map((bench, index) => (
        <li key={bench.id} className="group grid grid-cols-[2.5rem_minmax(0,1fr)_auto] gap-x-4 py-5">
          <Mono className="pt-0.5 text-sm text-ink-faint">{String(index + 1).padStart(2, '0')}</Mono>
          <div className="min-w-0">
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <Link
                to={hrefFor(bench.id)}
                className="text-[1.0625rem] font-semibold tracking-tight text-ink underline-offset-4 hover:text-accent hover:underline"
              >
                {bench.name}
              </Link>
              <RoleTag role={bench.role} />
            </div>
            {bench.description ? (
              <p className="mt-1 line-clamp-2 max-w-[40rem] text-sm leading-relaxed text-ink-soft">{bench.description}</p>
            ) : (
              <p className="mt-1 text-sm text-ink-faint italic">No description yet.</p>
            )}
          </div>
          <dl className="grid grid-cols-[auto_auto] content-start gap-x-3 gap-y-0.5 text-right text-sm">
            <dt className="text-ink-faint">lasers</dt>
            <dd>
              <Mono>{bench.laserCount}</Mono>
            </dd>
            <dt className="text-ink-faint">members</dt>
            <dd>
              <Mono>{bench.memberCount}</Mono>
            </dd>
            <dt className="text-ink-faint">since</dt>
            <dd>
              <Mono>{formatIsoDate(bench.createdAt)}</Mono>
            </dd>
          </dl>
        </li>
      ))}
    </ol>
  );
}
