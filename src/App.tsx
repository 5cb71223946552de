import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { AcceptInvitationRoute } from '@/routes/accept-invitation';
import { AccountRoute } from '@/routes/account';
import { CaughtMailRoute } from '@/routes/caught-mail';
import { ForgotPasswordRoute } from '@/routes/forgot-password';
import { MembersRoute } from '@/routes/members';
import { NotFoundRoute } from '@/routes/not-found';
import { OverviewRoute } from '@/routes/overview';
import { PublicLayout } from '@/routes/public-layout';
import { ResetPasswordRoute } from '@/routes/reset-password';
import { RootLayout } from '@/routes/root-layout';
import { RouteErrorScreen } from '@/routes/route-error';
import { bootstrapSessionLoader, requireSessionLoader } from '@/routes/session-loaders';
import { SignInRoute } from '@/routes/sign-in';

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
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

export function App() {
  return <RouterProvider router={router} />;
}
