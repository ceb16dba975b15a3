/**
 * The route table. Every page's loader fills the query cache with the same `queryOptions` its
 * component reads with `useSuspenseQuery`, so a page renders with its data or not at all; every
 * route has an error boundary with a retry.
 */
import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, redirect } from 'react-router';
import { paths } from '../config/paths';
import { accountLoader, AccountRoute } from './routes/account';
import { auditLoader, AuditRoute } from './routes/audit';
import { AppLayout, appLayoutLoader } from './routes/app-layout';
import { benchHomeHandle, benchHomeLoader, BenchHomeRoute } from './routes/bench-home';
import { benchMembersLoader, BenchMembersRoute } from './routes/bench-members';
import { benchesLoader, BenchesRoute } from './routes/benches';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { invitationLoader, InvitationRoute } from './routes/invitation';
import { captureUploadHandle, captureUploadLoader, CaptureUploadRoute } from './routes/capture-upload';
import { laserLoader, LaserRoute } from './routes/laser';
import { laserModelLoader, LaserModelRoute } from './routes/laser-model';
import { linkBudgetsLoader, LinkBudgetsRoute } from './routes/link-budgets';
import { NotFoundRoute } from './routes/not-found';
import { OutboxRoute } from './routes/outbox';
import { ResetPasswordRoute } from './routes/reset-password';
import { overlayLoader, OverlayRoute } from './routes/overlay';
import { overlaysLoader, OverlaysRoute } from './routes/overlays';
import { reportLoader, ReportRoute } from './routes/report';
import { overlayReportLoader, OverlayReportRoute } from './routes/report-overlay';
import { rfSpectraLoader, RfSpectraRoute } from './routes/rf-spectra';
import { rfSpectrumLoader, RfSpectrumRoute } from './routes/rf-spectrum';
import { RootHydrateFallback, RootLayout } from './routes/root-layout';
import { RootError, RouteError } from './routes/route-error';
import { SharedError, sharedLoader, SharedRoute } from './routes/shared';
import { signInLoader, SignInRoute } from './routes/sign-in';
import { simulationsLoader, SimulationsRoute } from './routes/simulations';
import { signUpLoader, SignUpRoute } from './routes/sign-up';
import { spectrumHandle, spectrumLoader, SpectrumRoute } from './routes/spectrum';
import { sweepLoader, SweepRoute } from './routes/sweep';

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    {
      id: 'root',
      Component: RootLayout,
      HydrateFallback: RootHydrateFallback,
      ErrorBoundary: RootError,
      children: [
        { path: paths.home.path, loader: () => redirect(paths.benches.list.getHref()) },
        { path: paths.auth.signIn.path, loader: signInLoader(queryClient), Component: SignInRoute, ErrorBoundary: RootError },
        { path: paths.auth.signUp.path, loader: signUpLoader(queryClient), Component: SignUpRoute, ErrorBoundary: RootError },
        { path: paths.auth.forgotPassword.path, Component: ForgotPasswordRoute, ErrorBoundary: RootError },
        { path: paths.auth.resetPassword.path, Component: ResetPasswordRoute, ErrorBoundary: RootError },
        { path: paths.invitation.path, loader: invitationLoader(queryClient), Component: InvitationRoute, ErrorBoundary: RootError },
        { path: paths.outbox.path, Component: OutboxRoute, ErrorBoundary: RootError },
        // the printable report: signed in, outside the site chrome
        { path: paths.benches.report.path, loader: reportLoader(queryClient), Component: ReportRoute, ErrorBoundary: RootError },
        { path: paths.benches.overlayReport.path, loader: overlayReportLoader(queryClient), Component: OverlayReportRoute, ErrorBoundary: RootError },
        {
          id: 'app',
          loader: appLayoutLoader(queryClient),
          Component: AppLayout,
          ErrorBoundary: RootError,
          children: [
            { path: paths.benches.list.path, loader: benchesLoader(queryClient), Component: BenchesRoute, ErrorBoundary: RouteError },
            {
              path: paths.benches.home.path,
              loader: benchHomeLoader(queryClient),
              Component: BenchHomeRoute,
              ErrorBoundary: RouteError,
              handle: benchHomeHandle,
            },
            {
              path: paths.benches.members.path,
              loader: benchMembersLoader(queryClient),
              Component: BenchMembersRoute,
              ErrorBoundary: RouteError,
            },
            {
              path: paths.benches.upload.path,
              loader: captureUploadLoader(queryClient),
              Component: CaptureUploadRoute,
              ErrorBoundary: RouteError,
              handle: captureUploadHandle,
            },
            {
              path: paths.benches.spectrum.path,
              loader: spectrumLoader(queryClient),
              Component: SpectrumRoute,
              ErrorBoundary: RouteError,
              handle: spectrumHandle,
            },
            { path: paths.benches.laser.path, loader: laserLoader(queryClient), Component: LaserRoute, ErrorBoundary: RouteError },
            { path: paths.benches.sweep.path, loader: sweepLoader(queryClient), Component: SweepRoute, ErrorBoundary: RouteError },
            { path: paths.benches.laserModel.path, loader: laserModelLoader(queryClient), Component: LaserModelRoute, ErrorBoundary: RouteError },
            { path: paths.benches.linkBudgets.path, loader: linkBudgetsLoader(queryClient), Component: LinkBudgetsRoute, ErrorBoundary: RouteError },
            { path: paths.benches.simulations.path, loader: simulationsLoader(queryClient), Component: SimulationsRoute, ErrorBoundary: RouteError },
            { path: paths.benches.overlays.path, loader: overlaysLoader(queryClient), Component: OverlaysRoute, ErrorBoundary: RouteError },
            { path: paths.benches.overlay.path, loader: overlayLoader(queryClient), Component: OverlayRoute, ErrorBoundary: RouteError },
            { path: paths.benches.rfSpectra.path, loader: rfSpectraLoader(queryClient), Component: RfSpectraRoute, ErrorBoundary: RouteError },
            { path: paths.benches.rfSpectrum.path, loader: rfSpectrumLoader(queryClient), Component: RfSpectrumRoute, ErrorBoundary: RouteError },
            { path: paths.account.path, loader: accountLoader(queryClient), Component: AccountRoute, ErrorBoundary: RouteError },
            { path: paths.audit.path, loader: auditLoader(queryClient), Component: AuditRoute, ErrorBoundary: RouteError },
          ],
        },
        { path: paths.shared.path, loader: sharedLoader(queryClient), Component: SharedRoute, ErrorBoundary: SharedError },
        { path: '*', Component: NotFoundRoute },
      ],
    },
  ]);
}

export type AppRouter = ReturnType<typeof createAppRouter>;
