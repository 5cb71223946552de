import type { AnyRouteSpec } from '../http/define-route';
import { systemRoutes } from './system.routes';

/** Every API route of the server; the OpenAPI document and the route tests read this list. */
export const apiRoutes: AnyRouteSpec[] = [...systemRoutes];
