/** /benches/:benchId/members — who is on the bench, with their roles; owners add and change. */
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { BenchRole } from '../../../server/contracts/benches';
import { PageHeader } from '../../components/layout/page-header';
import { Mono } from '../../components/ui/quantity';
import { ROLE_DESCRIPTIONS, RoleTag } from '../../components/ui/role-tag';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { useSignedInUser } from '../../features/auth/api/get-me';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { benchKeys } from '../../features/benches/api/keys';
import { InvitationList } from '../../features/invitations/components/invitation-list';
import { InviteForm } from '../../features/invitations/components/invite-form';
import { membersQueryOptions, useMembers } from '../../features/members/api/get-members';
import { AddMemberForm } from '../../features/members/components/add-member-form';
import { MemberList } from '../../features/members/components/member-list';

export const benchMembersLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(membersQueryOptions(benchId)),
    ]);
    return null;
  };

export function BenchMembersRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const members = useMembers(benchId);
  const user = useSignedInUser();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const isOwner = bench.role === 'owner';
  const refreshBench = () => void queryClient.invalidateQueries({ queryKey: benchKeys.all });

  return (
    <>
      <title>{`Members of ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Members' },
        ]}
        title="Members"
        lede={`Who can see and change “${bench.name}”.`}
      />

      <Section
        id="members"
        className="mt-10"
        title="People on this bench"
        aside={
          <span className="text-sm text-ink-faint">
            <Mono>{members.length}</Mono> {members.length === 1 ? 'member' : 'members'}
          </span>
        }
      >
        <MemberList
          benchId={bench.id}
          benchName={bench.name}
          members={members}
          currentUserId={user.id}
          canManage={isOwner}
          onChanged={refreshBench}
          onLeft={() => navigate(paths.benches.list.getHref(), { replace: true })}
        />
      </Section>

      <div className="mt-12 grid grid-cols-[minmax(0,1fr)_20rem] gap-14">
        {isOwner ? (
          <div className="flex flex-col gap-10">
            <Panel id="invite" title="Invite by e-mail">
              <InviteForm benchId={bench.id} />
              <InvitationList benchId={bench.id} />
            </Panel>
            <Panel id="add-member" title="Add a member">
              <AddMemberForm benchId={bench.id} onChanged={refreshBench} />
            </Panel>
            <p className="text-sm text-ink-soft">
              Who did what on this bench, and when:{' '}
              <Link to={paths.audit.getHref(bench.id)} className="font-medium text-accent underline-offset-4 hover:underline">
                audit trail
              </Link>
            </p>
          </div>
        ) : (
          <p className="pt-1 text-sm text-ink-faint">Only owners add members or change roles. Ask one if someone is missing.</p>
        )}
        <section aria-labelledby="roles-heading">
          <h2 id="roles-heading" className="text-sm font-semibold text-ink">
            Roles
          </h2>
          <dl className="mt-3 flex flex-col gap-3">
            {BenchRole.options.map((r) => (
              <div key={r}>
                <dt>
                  <RoleTag role={r} />
                </dt>
                <dd className="mt-1 text-sm leading-relaxed text-ink-soft">{ROLE_DESCRIPTIONS[r]}</dd>
              </div>
            ))}
          </dl>
        </section>
      </div>
    </>
  );
}
