/** /invitation/:token — the link in an invitation e-mail: join the bench (creating the account if needed). */
import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router';
import { EntryChrome } from '../../components/layout/site-chrome';
import { ErrorNote, LoadingNote } from '../../components/ui/notes';
import { paths } from '../../config/paths';
import { meQueryOptions, useMe } from '../../features/auth/api/get-me';
import { useInvitationPreview } from '../../features/invitations/api/preview-invitation';
import { InvitationAcceptance } from '../../features/invitations/components/invitation-acceptance';
import { isApiError } from '../../lib/api-client';
import { EntryAside } from './entry-aside';

export const invitationLoader = (queryClient: QueryClient) => async () => {
  await queryClient.ensureQueryData(meQueryOptions());
  return null;
};

export function InvitationRoute() {
  const token = useParams().token ?? '';
  const user = useMe();
  const navigate = useNavigate();
  const preview = useInvitationPreview(token);

  let body;
  if (preview.isPending) body = <LoadingNote>Reading the invitation…</LoadingNote>;
  else if (preview.isError) {
    const e = preview.error;
    const gone = isApiError(e) && e.status === 410;
    const unknown = isApiError(e) && (e.status === 404 || e.status === 400);
    body = (
      <ErrorNote
        title={gone ? 'This invitation can no longer be used' : unknown ? 'This invitation link is not valid' : 'The invitation could not be read'}
        message={e.message}
        onRetry={gone || unknown ? undefined : () => void preview.refetch()}
      >
        <Link to={user ? paths.benches.list.getHref() : paths.auth.signIn.getHref()} className="text-sm font-medium text-accent underline-offset-4 hover:underline">
          {user ? 'Go to your benches' : 'Sign in'}
        </Link>
      </ErrorNote>
    );
  } else {
    body = (
      <InvitationAcceptance
        token={token}
        invitation={preview.data.invitation}
        user={user}
        onJoined={(benchId) => navigate(paths.benches.home.getHref(benchId), { replace: true })}
      />
    );
  }

  return (
    <EntryChrome aside={<EntryAside />}>
      <title>Invitation · Phaseloom</title>
      <h1 className="text-2xl font-semibold tracking-tight">Join a bench</h1>
      {body}
    </EntryChrome>
  );
}
