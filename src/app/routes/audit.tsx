/** /benches/:benchId/audit — the bench's audit trail, for owners: who did what, when; filters. */
import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import type { AuditAction } from '../../../server/contracts/audit';
import { PageHeader } from '../../components/layout/page-header';
import { Button } from '../../components/ui/button';
import { ErrorNote, LoadingNote } from '../../components/ui/notes';
import { paths } from '../../config/paths';
import { useAudit } from '../../features/audit/api/get-audit';
import { AuditFilters, NO_FILTERS, type AuditFilterValues } from '../../features/audit/components/audit-filters';
import { AuditTable } from '../../features/audit/components/audit-table';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { membersQueryOptions, useMembers } from '../../features/members/api/get-members';

export const auditLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([queryClient.ensureQueryData(benchQueryOptions(benchId)), queryClient.ensureQueryData(membersQueryOptions(benchId))]);
    return null;
  };

/** Local calendar day → the UTC instant its midnight is (the start of the day where the reader is). */
function dayStart(date: string, plusDays = 0): string | undefined {
  if (!date) return undefined;
  const [y, m, d] = date.split('-').map(Number);
  return new Date(y, m - 1, d + plusDays).toISOString();
}

export function AuditRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const members = useMembers(benchId);
  const [filters, setFilters] = useState<AuditFilterValues>(NO_FILTERS);
  const [cursors, setCursors] = useState<string[]>([]);
  const before = cursors.at(-1);
  const audit = useAudit(benchId, {
    action: (filters.action || undefined) as AuditAction | undefined,
    actorId: filters.actorId || undefined,
    from: dayStart(filters.fromDate),
    to: dayStart(filters.toDate, 1),
    limit: 50,
    before,
  });

  return (
    <>
      <title>{`Audit trail of ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Audit trail' },
        ]}
        title="Audit trail"
        lede="Uploads, deletions, analyses, member changes, invitations, share links and members’ sign-ins. Entries are never changed or removed."
      />
      {bench.role !== 'owner' ? (
        <ErrorNote className="mt-10" title="Owners only" message="Only the bench’s owners can read its audit trail." />
      ) : (
        <div className="mt-10 flex flex-col gap-8">
          <AuditFilters
            members={members}
            value={filters}
            onApply={(v) => {
              setFilters(v);
              setCursors([]);
            }}
          />
          {audit.isPending ? (
            <LoadingNote>Reading the trail…</LoadingNote>
          ) : audit.isError ? (
            <ErrorNote message={audit.error.message} onRetry={() => void audit.refetch()} />
          ) : (
            <>
              <AuditTable events={audit.data.events} />
              <div className="flex gap-4">
                {cursors.length > 0 && (
                  <Button variant="secondary" size="sm" onClick={() => setCursors((c) => c.slice(0, -1))}>
                    Newer
                  </Button>
                )}
                {audit.data.nextBefore && (
                  <Button variant="secondary" size="sm" onClick={() => setCursors((c) => [...c, audit.data.nextBefore as string])}>
                    Older
                  </Button>
                )}
              </div>
            </>
          )}
        </div>
      )}
    </>
  );
}
