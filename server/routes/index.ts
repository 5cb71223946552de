import type { AnyRouteSpec } from '../http/define-route';
import { accountRoutes } from './account.routes';
import { invitationRoutes } from './invitations.routes';
import { memberRoutes } from './members.routes';
import { sessionRoutes } from './session.routes';
import { systemRoutes } from './system.routes';

/** Every API route of the server; the OpenAPI document and the permission matrix test read this list. */
export const apiRoutes: AnyRouteSpec[] = [
  ...systemRoutes,
  ...sessionRoutes,
  ...accountRoutes,
  ...invitationRoutes,
  ...memberRoutes,
];
