/** /account — the signed-in person's name and e-mail, and signing out. */
import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { meQueryOptions, useSignedInUser } from '../../features/auth/api/get-me';
import { AccountDetails } from '../../features/auth/components/account-details';
import { SignOutButton } from '../../features/auth/components/sign-out-button';

export const accountLoader = (queryClient: QueryClient) => async () => {
  await queryClient.ensureQueryData(meQueryOptions());
  return null;
};

export function AccountRoute() {
  const user = useSignedInUser();
  const navigate = useNavigate();
  return (
    <>
      <title>Account · Phaseloom</title>
      <PageHeader title="Account" lede="Your name as bench colleagues see it, and the e-mail you sign in with." />
      <div className="mt-10 grid max-w-[44rem] gap-14">
        <Section id="account-details" title="You">
          <AccountDetails user={user} />
        </Section>
        <Section id="session" title="Session" lede="Signing out ends the session in this browser.">
          <SignOutButton onSignedOut={() => navigate(paths.auth.signIn.getHref(), { replace: true })} />
        </Section>
      </div>
    </>
  );
}
