import { QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import { createMemoryRouter, matchRoutes, RouterProvider } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import type { Session } from '@shared/schemas/auth';
import { appRoutes } from '@/app-routes';
import { authKeys } from '@/features/auth/api/auth-keys';
import { paths } from '@/lib/paths';
import { queryClient } from '@/lib/query-client';
import { AccountRoute } from '@/routes/account';
import { CaughtMailRoute } from '@/routes/caught-mail';
import { AccountSessionsRoute } from '@/routes/account-sessions';
import { CompareRoute } from '@/routes/compare';
import { CompoundDetailRoute } from '@/routes/compound-detail';
import { LibraryRoute } from '@/routes/library';
import { LibrarySettingsRoute } from '@/routes/library-settings';
import { MembersRoute } from '@/routes/members';
import { NewStudyRoute } from '@/routes/new-study';
import { NotFoundRoute } from '@/routes/not-found';
import { OverviewRoute } from '@/routes/overview';
import { PlannerRoute } from '@/routes/planner';
import { ScenarioRoute } from '@/routes/scenario';
import { ScenariosRoute } from '@/routes/scenarios';
import { SignInRoute } from '@/routes/sign-in';
import { StudiesRoute } from '@/routes/studies';
import { StudyRoute } from '@/routes/study';

const lab = '0b7e6d4e-1c2a-4f5e-9d3b-2a1c0e9f8d7a';
const otherLab = '5f4e3d2c-1b0a-4c9d-8e7f-6a5b4c3d2e1f';
const id = '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d';

/** The screen the router shows at an address: the component the deepest matching route loads. */
async function screenAt(address: string) {
  const matches = matchRoutes(appRoutes, address) ?? [];
  const lazy = matches.at(-1)?.route.lazy;
  if (typeof lazy !== 'function') return undefined;
  return ((await lazy()) as { Component?: unknown }).Component;
}

describe('client addresses', () => {
  it('when an address that worked before is opened, then the same screen answers it', async () => {
    const before: [string, unknown][] = [
      ['/', OverviewRoute],
      ['/sign-in', SignInRoute],
      ['/account', AccountRoute],
      ['/account/sessions', AccountSessionsRoute],
      ['/mail', CaughtMailRoute],
      [`/labs/${lab}/members`, MembersRoute],
      [`/labs/${lab}/mail`, CaughtMailRoute],
      [`/labs/${lab}/studies`, StudiesRoute],
      [`/labs/${lab}/studies/new`, NewStudyRoute],
      [`/labs/${lab}/studies/${id}`, StudyRoute],
      [`/labs/${lab}/library`, LibraryRoute],
      [`/labs/${lab}/library/${id}`, CompoundDetailRoute],
      [`/labs/${lab}/settings`, LibrarySettingsRoute],
      [`/labs/${lab}/planner`, PlannerRoute],
      [`/labs/${lab}/compare`, CompareRoute],
      [`/labs/${lab}/scenarios`, ScenariosRoute],
      [`/labs/${lab}/scenarios/new`, ScenarioRoute],
      [`/labs/${lab}/scenarios/${id}`, ScenarioRoute],
      [`/labs/${lab}`, NotFoundRoute],
      [`/labs/${lab}/nothing-here`, NotFoundRoute],
      ['/nothing-here', NotFoundRoute],
    ];
    const found = await Promise.all(before.map(async ([address]) => [address, await screenAt(address)]));
    expect(found).toEqual(before);
  });

  it('when a link is built from paths, then it leads to the screen it names', async () => {
    expect(await screenAt(paths.study(lab, id))).toBe(StudyRoute);
    expect(await screenAt(paths.compound(lab, id, 'add-potential').split('#')[0]!)).toBe(CompoundDetailRoute);
    expect(await screenAt(paths.newStudy(lab, { emitterId: id, title: 'Titration with TEA' }).split('?')[0]!)).toBe(
      NewStudyRoute,
    );
    expect(await screenAt(paths.scenario(lab, id))).toBe(ScenarioRoute);
    expect(await screenAt(paths.labSettings(lab))).toBe(LibrarySettingsRoute);
    expect(await screenAt(paths.caughtMail())).toBe(CaughtMailRoute);
    expect(await screenAt(paths.accountSessions())).toBe(AccountSessionsRoute);
  });

  it('when a query is given, then empty values are left out and the rest is encoded', () => {
    expect(paths.newStudy(lab, { emitterId: id, title: 'A & B', stockMilli: undefined, quencherId: '' })).toBe(
      `/labs/${lab}/studies/new?emitterId=${id}&title=A+%26+B`,
    );
    expect(paths.newStudy(lab)).toBe(`/labs/${lab}/studies/new`);
    expect(paths.signIn(`/labs/${lab}/studies?q=x`)).toBe(`/sign-in?next=%2Flabs%2F${lab}%2Fstudies%3Fq%3Dx`);
  });
});

function signedIn(session: Pick<Session, 'user'> & Partial<Session>) {
  // The guard's loader reads the session from this cache (staleTime Infinity), so nothing is fetched.
  queryClient.clear();
  queryClient.setQueryData(authKeys.session(), {
    csrfToken: 'test',
    mailCatcher: true,
    twoFactor: { enabled: false, verified: false, recoveryCodesLeft: 0 },
    ...session,
  });
}

function openApp(address: string) {
  const router = createMemoryRouter(appRoutes, { initialEntries: [address] });
  render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
}

describe('labs/:labId layout', () => {
  const user = {
    id,
    email: 'ada@example.invalid',
    name: 'Ada Example',
    labs: [
      {
        labId: lab,
        labName: 'Invented Photoredox Group',
        isDemo: false,
        role: 'researcher' as const,
        requireTwoFactor: false,
      },
    ],
  };

  it('when a member opens a lab screen, then the screen gets the membership from the layout', async () => {
    signedIn({ user });
    openApp(paths.planner(lab));
    expect(await screen.findByRole('heading', { name: 'Titration planner' })).toBeTruthy();
    expect(screen.queryByText('Not available')).toBeNull();
  });

  it('when someone opens a lab they are not in, then every screen there says so instead of loading', async () => {
    signedIn({ user });
    for (const address of [paths.planner(otherLab), paths.compare(otherLab), paths.scenarios(otherLab)]) {
      openApp(address);
      expect(await screen.findByRole('heading', { name: 'Not available' })).toBeTruthy();
      expect(screen.getByText('You are not a member of this lab.')).toBeTruthy();
      expect(fetch).not.toHaveBeenCalled();
      cleanup();
    }
  });

  it('when a researcher opens the lab settings, then the role check of the screen still applies', async () => {
    signedIn({ user });
    openApp(paths.labSettings(lab));
    expect(await screen.findByText("Only the lab's admins change its settings.")).toBeTruthy();
  });
});
