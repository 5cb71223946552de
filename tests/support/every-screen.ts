import type { Sequelize } from 'sequelize';
import { Op } from 'sequelize';
import { Compound, Lab, Membership, Study, User } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { listTemperatureSeries } from '../../server/services/mechanism/temperature-series.service';
import { createScenario } from '../../server/services/scenarios/scenario.service';

/** One screen of the app at an address, and the page heading that says it has arrived. */
export interface Screen {
  name: string;
  path: string;
  heading: string | RegExp;
}

/** The demo admin who can open every screen of the first demo lab. */
export const demoAdmin = { email: demoPeople[0]!.email, password: demoPassword };

/** Screens open to anyone: the sign-in and the two link-driven screens (with links that no longer work). */
export const publicScreens: Screen[] = [
  { name: 'sign-in', path: '/sign-in', heading: 'Sign in' },
  { name: 'forgot-password', path: '/forgot-password', heading: 'Choose a new password' },
  { name: 'reset-password-incomplete', path: '/reset-password', heading: 'This link is incomplete' },
  {
    name: 'invitation-expired',
    path: '/invitations/no-such-invitation-token-00000',
    heading: 'This invitation no longer works',
  },
];

/**
 * Loads the demo data (and a saved scenario, which the demo has none of) and lists every
 * signed-in screen with a record to show: two studies (one approved with lifetimes, one still
 * open), an emitter's library page, a comparison with a trend plot, a scenario with shares and a
 * temperature series with its two plots.
 */
export async function signedInScreens(sequelize: Sequelize): Promise<Screen[]> {
  await seedDemoData(sequelize);
  const lab = (await Lab.findOne({ where: { slug: demoLabs[0].slug } }))!;
  const admin = (await User.findOne({ where: { email: demoAdmin.email } }))!;
  const membership = (await Membership.findOne({ where: { labId: lab.id, userId: admin.id } }))!;
  const current = { labId: lab.id, isCurrent: true, kq: { [Op.ne]: null } };
  const approved = (await Study.findOne({ where: { ...current, status: 'approved' }, order: [['title', 'ASC']] }))!;
  const open = (await Study.findOne({
    where: { ...current, status: { [Op.ne]: 'approved' } },
    order: [['title', 'ASC']],
  }))!;
  const emitter = (await Compound.findByPk(approved.emitterId))!;
  const quencher = (await Compound.findByPk(approved.quencherId))!;
  const labContext = { id: lab.id, name: lab.name, isDemo: true, role: 'admin' as const, membershipId: membership.id };
  const series = (await listTemperatureSeries(labContext)).items.find((group) => group.ready)!;
  const scenario = await createScenario(
    sequelize,
    labContext,
    { userId: admin.id, ip: null },
    {
      name: 'Demo coupling at reaction strength',
      emitterId: emitter.id,
      solvent: 'acetonitrile',
      tau0: 1.1e-6,
      tau0Source: 'demo value',
      notes: '',
      components: [
        { kind: 'compound', compoundId: quencher.id, concentration: 0.05 },
        { kind: 'oxygen', concentration: 1.9e-3, manualKq: 2.4e9, manualKqSource: 'demo value' },
      ],
    },
  );
  const inLab = (rest: string) => `/labs/${lab.id}/${rest}`;
  return [
    { name: 'overview', path: '/', heading: 'Overview' },
    { name: 'account', path: '/account', heading: 'Account' },
    { name: 'account-sessions', path: '/account/sessions', heading: 'Signed-in browsers' },
    { name: 'studies', path: inLab('studies'), heading: 'Studies' },
    { name: 'new-study', path: inLab('studies/new'), heading: 'New quenching study' },
    { name: 'study-approved', path: inLab(`studies/${approved.id}`), heading: approved.title },
    { name: 'study-open', path: inLab(`studies/${open.id}`), heading: open.title },
    { name: 'library', path: inLab('library'), heading: 'Library' },
    { name: 'compound', path: inLab(`library/${emitter.id}`), heading: emitter.name },
    { name: 'lab-settings', path: inLab('settings'), heading: 'Lab settings' },
    { name: 'members', path: inLab('members'), heading: 'Members' },
    { name: 'caught-mail', path: '/mail', heading: 'Caught mail' },
    { name: 'planner', path: inLab('planner'), heading: 'Titration planner' },
    { name: 'compare', path: inLab(`compare?side=emitter&compoundId=${emitter.id}`), heading: 'Compare' },
    { name: 'scenarios', path: inLab('scenarios'), heading: 'Who quenches?' },
    { name: 'scenario-new', path: inLab('scenarios/new'), heading: 'New reaction scenario' },
    { name: 'scenario', path: inLab(`scenarios/${scenario.id}`), heading: scenario.name },
    { name: 'temperature', path: inLab('temperature'), heading: 'Temperature series' },
    {
      name: 'temperature-series',
      path: inLab(`temperature?studies=${series.studyIds.join(',')}`),
      heading: 'Temperature series',
    },
    { name: 'not-found', path: '/no/such/screen', heading: 'Nothing here' },
  ];
}
