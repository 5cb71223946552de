import type { AnyRouteSpec } from '../http/define-route';
import { absorptionTitrationRoutes } from './absorption-titrations.routes';
import { accountRoutes } from './account.routes';
import { accountSessionRoutes } from './account-sessions.routes';
import { caughtMailRoutes } from './caught-mail.routes';
import { compoundMeasurementRoutes } from './compound-measurements.routes';
import { comparisonRoutes } from './comparisons.routes';
import { compoundRoutes } from './compounds.routes';
import { dashboardRoutes } from './dashboard.routes';
import { fileReadingRoutes } from './file-reading.routes';
import { decaySetRoutes } from './decay-sets.routes';
import { invitationRoutes } from './invitations.routes';
import { librarySettingsRoutes } from './library-settings.routes';
import { mechanismRoutes } from './mechanism.routes';
import { memberRoutes } from './members.routes';
import { plannerRoutes } from './planner.routes';
import { reportRoutes } from './reports.routes';
import { scenarioRoutes } from './scenarios.routes';
import { sessionRoutes } from './session.routes';
import { studyRoutes } from './studies.routes';
import { studyReviewRoutes } from './study-reviews.routes';
import { studyUploadRoutes } from './study-uploads.routes';
import { systemRoutes } from './system.routes';
import { twoFactorRoutes } from './two-factor.routes';

/** Every API route of the server; the OpenAPI document and the permission matrix test read this list. */
export const apiRoutes: AnyRouteSpec[] = [
  ...systemRoutes,
  ...sessionRoutes,
  ...accountRoutes,
  ...accountSessionRoutes,
  ...twoFactorRoutes,
  ...caughtMailRoutes,
  ...invitationRoutes,
  ...memberRoutes,
  ...studyRoutes,
  ...studyUploadRoutes,
  ...fileReadingRoutes,
  ...decaySetRoutes,
  ...studyReviewRoutes,
  ...plannerRoutes,
  ...scenarioRoutes,
  ...comparisonRoutes,
  ...mechanismRoutes,
  ...absorptionTitrationRoutes,
  ...dashboardRoutes,
  ...reportRoutes,
  ...compoundRoutes,
  ...compoundMeasurementRoutes,
  ...librarySettingsRoutes,
];
