import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { apiErrorSchema } from '@shared/schemas/error';
import type { AnyRouteSpec } from './define-route';

const toOpenApiPath = (expressPath: string) => expressPath.replace(/:(\w+)/g, '{$1}');

/** "get /api/labs/:labId/studies/:studyId" becomes "getLabsByLabIdStudiesByStudyId". */
function operationId(route: AnyRouteSpec): string {
  const words = route.path
    .replace(/^\/api\/?/, '')
    .split(/[/.-]/)
    .filter(Boolean)
    .map((part) => (part.startsWith(':') ? `By${part[1]!.toUpperCase()}${part.slice(2)}` : part))
    .map((part) => part[0]!.toUpperCase() + part.slice(1));
  return `${route.method}${words.join('') || 'Root'}`;
}

/**
 * The answers every guard may give, so each operation lists them: the session and role checks
 * (401 signed out, 404 not a member of the lab, 403 role too low), the CSRF check on every change
 * (403), the attempt limits (429), and the turn every read but /api/health may wait for (503 when
 * too many wait, server/middleware/read-admission.ts).
 */
function guardResponses(route: AnyRouteSpec): Record<number, string> {
  const added: Record<number, string> = {};
  if (route.access !== 'public') added[401] = 'Not signed in';
  if (typeof route.access === 'object') {
    added[403] = `Role in this lab below ${route.access.lab}`;
    added[404] = 'No such lab, or not a member of it';
  }
  if (route.method !== 'get') added[403] ??= 'CSRF token missing or stale (send x-csrf-token)';
  if (route.rateLimit) added[429] = 'Too many attempts; see Retry-After';
  if (route.method === 'get' && route.path !== '/api/health')
    added[503] = 'Too many reads waiting for a turn (server_busy); see Retry-After';
  return added;
}

/** A signed-in route needs the session cookie; every change also needs the CSRF header. */
function securityOf(route: AnyRouteSpec): Array<Record<string, string[]>> {
  const change = route.method !== 'get';
  if (route.access === 'public') return change ? [{ csrfToken: [] }] : [];
  return [change ? { sessionCookie: [], csrfToken: [] } : { sessionCookie: [] }];
}

/** Builds the OpenAPI 3.1 document from the same route specs that the server mounts. */
export function buildOpenApiDocument(routes: AnyRouteSpec[], version: string) {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'sessionCookie', {
    type: 'apiKey',
    in: 'cookie',
    name: 'halflight.sid',
    description: 'The session cookie set by POST /api/session (__Host-halflight.sid behind TLS)',
  });
  registry.registerComponent('securitySchemes', 'csrfToken', {
    type: 'apiKey',
    in: 'header',
    name: 'x-csrf-token',
    description:
      'The CSRF token from GET /api/csrf-token or the session answer; required on every POST, PUT, PATCH and DELETE',
  });
  for (const route of routes) {
    const request: Record<string, unknown> = {};
    if (route.request?.params) request.params = route.request.params;
    if (route.request?.query) request.query = route.request.query;
    if (route.request?.body) {
      request.body = { content: { 'application/json': { schema: route.request.body } } };
    }
    const described: Record<number, { description: string; schema?: unknown }> = {};
    for (const [status, description] of Object.entries(guardResponses(route))) {
      described[Number(status)] = { description };
    }
    Object.assign(described, route.responses);
    const responses = Object.fromEntries(
      Object.entries(described as AnyRouteSpec['responses']).map(([status, response]) => {
        const schema = response.schema ?? (Number(status) >= 400 ? apiErrorSchema : undefined);
        return [
          status,
          schema
            ? { description: response.description, content: { 'application/json': { schema } } }
            : { description: response.description },
        ];
      }),
    );
    registry.registerPath({
      method: route.method,
      path: toOpenApiPath(route.path),
      summary: route.summary,
      operationId: operationId(route),
      security: securityOf(route),
      tags: route.tags,
      request,
      responses,
    });
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Halflight API',
      version,
      description:
        'Luminescence-quenching studies. Numbers travel in SI-coherent units: mol/L, s, V, eV, M^-1 s^-1. ' +
        'Errors always have the shape { error: { code, message, details? } }.',
    },
    servers: [{ url: '/' }],
    security: [{ sessionCookie: [] }],
  });
}
