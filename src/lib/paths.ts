/**
 * Every address of the client, in one place. The router declares `routePatterns` (the screens of a
 * lab are relative to `labs/:labId`); links and redirects call the builders in `paths`. Moving a
 * screen means changing both here, side by side, so no link is left pointing at the old address.
 */
export const routePatterns = {
  signIn: 'sign-in',
  forgotPassword: 'forgot-password',
  resetPassword: 'reset-password',
  invitation: 'invitations/:token',
  account: 'account',
  accountSessions: 'account/sessions',
  caughtMail: 'mail',
  lab: 'labs/:labId',
  // Inside labs/:labId:
  studies: 'studies',
  newStudy: 'studies/new',
  study: 'studies/:studyId',
  library: 'library',
  compound: 'library/:compoundId',
  labSettings: 'settings',
  members: 'members',
  planner: 'planner',
  compare: 'compare',
  scenarios: 'scenarios',
  scenario: 'scenarios/:scenarioId',
  temperatureSeries: 'temperature',
} as const;

type Query = Record<string, string | number | boolean | null | undefined>;

/** Appends the query, leaving out empty values; no `?` when nothing is left. */
function withQuery(path: string, query?: Query): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

const inLab = (labId: string, rest: string) => `/labs/${encodeURIComponent(labId)}/${rest}`;

export const paths = {
  overview: () => '/',
  /** `next` is where to return after signing in (an address inside the app). */
  signIn: (next?: string) => withQuery('/sign-in', { next }),
  forgotPassword: () => '/forgot-password',
  account: () => '/account',
  accountSessions: () => '/account/sessions',
  /** Mail the local catcher took for me (and invitations I sent). */
  caughtMail: () => '/mail',
  studies: (labId: string) => inLab(labId, 'studies'),
  /** `preset` pre-fills the form (emitterId, quencherId, title, volumes; see the new-study screen). */
  newStudy: (labId: string, preset?: Query) => withQuery(inLab(labId, 'studies/new'), preset),
  study: (labId: string, studyId: string) => inLab(labId, `studies/${encodeURIComponent(studyId)}`),
  library: (labId: string) => inLab(labId, 'library'),
  /** `section` is an anchor on the compound's screen (e.g. `add-potential`). */
  compound: (labId: string, compoundId: string, section?: string) =>
    inLab(labId, `library/${encodeURIComponent(compoundId)}`) + (section ? `#${section}` : ''),
  labSettings: (labId: string) => inLab(labId, 'settings'),
  members: (labId: string) => inLab(labId, 'members'),
  planner: (labId: string) => inLab(labId, 'planner'),
  compare: (labId: string) => inLab(labId, 'compare'),
  scenarios: (labId: string) => inLab(labId, 'scenarios'),
  newScenario: (labId: string) => inLab(labId, 'scenarios/new'),
  scenario: (labId: string, scenarioId: string) => inLab(labId, `scenarios/${encodeURIComponent(scenarioId)}`),
  /** `studyIds` are the studies read as one series; none lists the lab's candidate series. */
  temperatureSeries: (labId: string, studyIds?: string[]) =>
    withQuery(inLab(labId, 'temperature'), { studies: studyIds?.join(',') }),
  /** The same kind of screen in another lab (the lab switcher): `screen` is a first segment under the lab. */
  labScreen: (labId: string, screen: string) => inLab(labId, screen),
} as const;

/** The same screen in another lab, from an address inside a lab: `/labs/a/library/x` gives `library`. */
export function labScreenOf(pathname: string): string | null {
  return /^\/labs\/[^/]+\/([^/]+)/.exec(pathname)?.[1] ?? null;
}
