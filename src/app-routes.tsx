import type { ComponentType } from 'react';
import type { RouteObject } from 'react-router-dom';
import { routePatterns as at } from '@/lib/paths';
import { AppFrame } from '@/routes/app-frame';
import { PublicLayout } from '@/routes/public-layout';
import { RouteErrorScreen } from '@/routes/route-error';
import { bootstrapSessionLoader, requireSessionLoader } from '@/routes/session-loaders';

/**
 * Each screen's module is fetched when its address is first opened (React Router's `lazy`), so
 * the sign-in screen does not load the charts, the planner or the library, nor the signed-in frame;
 * the skeleton, the public frame, the session guard and the error screen are in the first file.
 */
type ScreenModule = () => Promise<ComponentType>;

/** One screen at an address, loaded on demand, with the error screen every route shows when it fails. */
const screen = (path: string, load: ScreenModule): RouteObject => ({
  path,
  lazy: async () => ({ Component: await load() }),
  errorElement: <RouteErrorScreen />,
});

/** The screen at its parent's own address. */
const indexScreen = (load: ScreenModule): RouteObject => ({
  index: true,
  lazy: async () => ({ Component: await load() }),
  errorElement: <RouteErrorScreen />,
});

/** Loaders of every screen, by the name of its module in src/routes/ (tests resolve them too). */
export const screenModules = {
  signIn: () => import('@/routes/sign-in').then((module) => module.SignInRoute),
  forgotPassword: () => import('@/routes/forgot-password').then((module) => module.ForgotPasswordRoute),
  resetPassword: () => import('@/routes/reset-password').then((module) => module.ResetPasswordRoute),
  invitation: () => import('@/routes/accept-invitation').then((module) => module.AcceptInvitationRoute),
  overview: () => import('@/routes/overview').then((module) => module.OverviewRoute),
  account: () => import('@/routes/account').then((module) => module.AccountRoute),
  accountSessions: () => import('@/routes/account-sessions').then((module) => module.AccountSessionsRoute),
  members: () => import('@/routes/members').then((module) => module.MembersRoute),
  caughtMail: () => import('@/routes/caught-mail').then((module) => module.CaughtMailRoute),
  studies: () => import('@/routes/studies').then((module) => module.StudiesRoute),
  newStudy: () => import('@/routes/new-study').then((module) => module.NewStudyRoute),
  study: () => import('@/routes/study').then((module) => module.StudyRoute),
  library: () => import('@/routes/library').then((module) => module.LibraryRoute),
  compound: () => import('@/routes/compound-detail').then((module) => module.CompoundDetailRoute),
  labSettings: () => import('@/routes/library-settings').then((module) => module.LibrarySettingsRoute),
  planner: () => import('@/routes/planner').then((module) => module.PlannerRoute),
  compare: () => import('@/routes/compare').then((module) => module.CompareRoute),
  temperatureSeries: () => import('@/routes/temperature-series').then((module) => module.TemperatureSeriesRoute),
  scenarios: () => import('@/routes/scenarios').then((module) => module.ScenariosRoute),
  scenario: () => import('@/routes/scenario').then((module) => module.ScenarioRoute),
  notFound: () => import('@/routes/not-found').then((module) => module.NotFoundRoute),
} satisfies Record<string, ScreenModule>;

const load = screenModules;

/** The client's routes; addresses come from src/lib/paths.ts. */
export const appRoutes: RouteObject[] = [
  {
    element: <AppFrame />,
    // Until the first screen's module and the session have arrived, index.html's skeleton stays on view.
    HydrateFallback: () => null,
    errorElement: <RouteErrorScreen />,
    children: [
      {
        // Reachable signed out: signing in, recovering a password, answering an invitation.
        element: <PublicLayout />,
        loader: bootstrapSessionLoader,
        errorElement: <RouteErrorScreen />,
        children: [
          screen(at.signIn, load.signIn),
          screen(at.forgotPassword, load.forgotPassword),
          screen(at.resetPassword, load.resetPassword),
          screen(at.invitation, load.invitation),
        ],
      },
      {
        path: '/',
        // The signed-in frame comes with the first signed-in screen, while the session guard runs.
        lazy: () => import('@/routes/root-layout').then((module) => ({ Component: module.RootLayout })),
        loader: requireSessionLoader,
        errorElement: <RouteErrorScreen />,
        children: [
          indexScreen(load.overview),
          screen(at.account, load.account),
          screen(at.accountSessions, load.accountSessions),
          screen(at.caughtMail, load.caughtMail),
          {
            // Every lab screen: the membership is looked up once, here, and handed down (useLab).
            path: at.lab,
            lazy: () => import('@/routes/lab-layout').then((module) => ({ Component: module.LabLayout })),
            errorElement: <RouteErrorScreen />,
            children: [
              indexScreen(load.notFound),
              screen(at.members, load.members),
              // The caught-mail address of earlier versions (bookmarks); the mail is now per person.
              screen(at.caughtMail, load.caughtMail),
              screen(at.studies, load.studies),
              screen(at.newStudy, load.newStudy),
              screen(at.study, load.study),
              screen(at.library, load.library),
              screen(at.compound, load.compound),
              screen(at.labSettings, load.labSettings),
              screen(at.planner, load.planner),
              screen(at.compare, load.compare),
              screen(at.temperatureSeries, load.temperatureSeries),
              screen(at.scenarios, load.scenarios),
              screen(at.scenario, load.scenario),
            ],
          },
          screen('*', load.notFound),
        ],
      },
    ],
  },
];
