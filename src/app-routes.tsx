import type { ReactNode } from 'react';
import type { RouteObject } from 'react-router-dom';
import { routePatterns as at } from '@/lib/paths';
import { AcceptInvitationRoute } from '@/routes/accept-invitation';
import { AccountRoute } from '@/routes/account';
import { AccountSessionsRoute } from '@/routes/account-sessions';
import { CaughtMailRoute } from '@/routes/caught-mail';
import { CompareRoute } from '@/routes/compare';
import { CompoundDetailRoute } from '@/routes/compound-detail';
import { ForgotPasswordRoute } from '@/routes/forgot-password';
import { LabLayout } from '@/routes/lab-layout';
import { LibraryRoute } from '@/routes/library';
import { LibrarySettingsRoute } from '@/routes/library-settings';
import { MembersRoute } from '@/routes/members';
import { NewStudyRoute } from '@/routes/new-study';
import { NotFoundRoute } from '@/routes/not-found';
import { OverviewRoute } from '@/routes/overview';
import { PlannerRoute } from '@/routes/planner';
import { PublicLayout } from '@/routes/public-layout';
import { ResetPasswordRoute } from '@/routes/reset-password';
import { RootLayout } from '@/routes/root-layout';
import { RouteErrorScreen } from '@/routes/route-error';
import { ScenarioRoute } from '@/routes/scenario';
import { ScenariosRoute } from '@/routes/scenarios';
import { TemperatureSeriesRoute } from '@/routes/temperature-series';
import { bootstrapSessionLoader, requireSessionLoader } from '@/routes/session-loaders';
import { SignInRoute } from '@/routes/sign-in';
import { StudiesRoute } from '@/routes/studies';
import { StudyRoute } from '@/routes/study';

/** One screen at an address, with the error screen every route shows when it fails. */
const screen = (path: string, element: ReactNode): RouteObject => ({
  path,
  element,
  errorElement: <RouteErrorScreen />,
});

/** The client's routes; addresses come from src/lib/paths.ts. */
export const appRoutes: RouteObject[] = [
  {
    // Reachable signed out: signing in, recovering a password, answering an invitation.
    element: <PublicLayout />,
    loader: bootstrapSessionLoader,
    errorElement: <RouteErrorScreen />,
    children: [
      screen(at.signIn, <SignInRoute />),
      screen(at.forgotPassword, <ForgotPasswordRoute />),
      screen(at.resetPassword, <ResetPasswordRoute />),
      screen(at.invitation, <AcceptInvitationRoute />),
    ],
  },
  {
    path: '/',
    element: <RootLayout />,
    loader: requireSessionLoader,
    errorElement: <RouteErrorScreen />,
    children: [
      { index: true, element: <OverviewRoute />, errorElement: <RouteErrorScreen /> },
      screen(at.account, <AccountRoute />),
      screen(at.accountSessions, <AccountSessionsRoute />),
      screen(at.caughtMail, <CaughtMailRoute />),
      {
        // Every lab screen: the membership is looked up once, here, and handed down (useLab).
        path: at.lab,
        element: <LabLayout />,
        errorElement: <RouteErrorScreen />,
        children: [
          { index: true, element: <NotFoundRoute /> },
          screen(at.members, <MembersRoute />),
          // The caught-mail address of earlier versions (bookmarks); the mail is now per person.
          screen(at.caughtMail, <CaughtMailRoute />),
          screen(at.studies, <StudiesRoute />),
          screen(at.newStudy, <NewStudyRoute />),
          screen(at.study, <StudyRoute />),
          screen(at.library, <LibraryRoute />),
          screen(at.compound, <CompoundDetailRoute />),
          screen(at.labSettings, <LibrarySettingsRoute />),
          screen(at.planner, <PlannerRoute />),
          screen(at.compare, <CompareRoute />),
          screen(at.scenarios, <ScenariosRoute />),
          screen(at.temperatureSeries, <TemperatureSeriesRoute />),
          screen(at.scenario, <ScenarioRoute />),
        ],
      },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
];
