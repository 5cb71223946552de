import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { AcceptInvitationRoute } from '@/routes/accept-invitation';
import { AccountRoute } from '@/routes/account';
import { CaughtMailRoute } from '@/routes/caught-mail';
import { CompoundDetailRoute } from '@/routes/compound-detail';
import { ForgotPasswordRoute } from '@/routes/forgot-password';
import { LibraryRoute } from '@/routes/library';
import { LibrarySettingsRoute } from '@/routes/library-settings';
import { MembersRoute } from '@/routes/members';
import { NotFoundRoute } from '@/routes/not-found';
import { OverviewRoute } from '@/routes/overview';
import { CompareRoute } from '@/routes/compare';
import { PlannerRoute } from '@/routes/planner';
import { ScenarioRoute } from '@/routes/scenario';
import { ScenariosRoute } from '@/routes/scenarios';
import { PublicLayout } from '@/routes/public-layout';
import { ResetPasswordRoute } from '@/routes/reset-password';
import { RootLayout } from '@/routes/root-layout';
import { RouteErrorScreen } from '@/routes/route-error';
import { bootstrapSessionLoader, requireSessionLoader } from '@/routes/session-loaders';
import { SignInRoute } from '@/routes/sign-in';
import { NewStudyRoute } from '@/routes/new-study';
import { StudiesRoute } from '@/routes/studies';
import { StudyRoute } from '@/routes/study';

const router = createBrowserRouter([
  {
    // Reachable signed out: signing in, recovering a password, answering an invitation.
    element: <PublicLayout />,
    loader: bootstrapSessionLoader,
    errorElement: <RouteErrorScreen />,
    children: [
      { path: 'sign-in', element: <SignInRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'forgot-password', element: <ForgotPasswordRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'reset-password', element: <ResetPasswordRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'invitations/:token', element: <AcceptInvitationRoute />, errorElement: <RouteErrorScreen /> },
    ],
  },
  {
    path: '/',
    element: <RootLayout />,
    loader: requireSessionLoader,
    errorElement: <RouteErrorScreen />,
    children: [
      { index: true, element: <OverviewRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'account', element: <AccountRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/members', element: <MembersRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/mail', element: <CaughtMailRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/studies', element: <StudiesRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/studies/new', element: <NewStudyRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/studies/:studyId', element: <StudyRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/library', element: <LibraryRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/library/:compoundId', element: <CompoundDetailRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/settings', element: <LibrarySettingsRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/planner', element: <PlannerRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/compare', element: <CompareRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/scenarios', element: <ScenariosRoute />, errorElement: <RouteErrorScreen /> },
      { path: 'labs/:labId/scenarios/:scenarioId', element: <ScenarioRoute />, errorElement: <RouteErrorScreen /> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

export function App() {
  return <RouterProvider router={router} />;
}
