/** /account — the signed-in person's name and e-mail, personal API tokens, e-mail notices, and signing out. */
import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { PageHeader } from '../../components/layout/page-header';
import { Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { apiTokensQueryOptions } from '../../features/api-tokens/api/get-api-tokens';
import { ApiTokensPanel } from '../../features/api-tokens/components/api-tokens-panel';
import { meQueryOptions, useSignedInUser } from '../../features/auth/api/get-me';
import { AccountDetails } from '../../features/auth/components/account-details';
import { SignOutButton } from '../../features/auth/components/sign-out-button';
import { notificationSettingsQueryOptions } from '../../features/notifications/api/get-notification-settings';
import { AnalysisNoticeToggle } from '../../features/notifications/components/analysis-notice-toggle';

export const accountLoader = (queryClient: QueryClient) => async () => {
  await Promise.all([
    queryClient.ensureQueryData(meQueryOptions()),
    queryClient.ensureQueryData(apiTokensQueryOptions()),
    queryClient.ensureQueryData(notificationSettingsQueryOptions()),
  ]);
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
        <Section
          id="api-tokens"
          title="API tokens"
          lede="For scripts that upload and read on your behalf (the README's API section has examples). A token acts as you, with your role on each bench."
        >
          <ApiTokensPanel />
        </Section>
        <Section id="notices" title="E-mail notices" lede="Off unless you turn them on.">
          <AnalysisNoticeToggle />
        </Section>
        <Section id="session" title="Session" lede="Signing out ends the session in this browser.">
          <SignOutButton onSignedOut={() => navigate(paths.auth.signIn.getHref(), { replace: true })} />
        </Section>
      </div>
    </>
  );
}
