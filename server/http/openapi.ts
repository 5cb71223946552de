import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { apiErrorSchema } from '@shared/schemas/error';
import type { AnyRouteSpec } from './define-route';

const toOpenApiPath = (expressPath: string) => expressPath.replace(/:(\w+)/g, '{$1}');

/** Builds the OpenAPI 3.1 document from the same route specs that the server mounts. */
export function buildOpenApiDocument(routes: AnyRouteSpec[], version: string) {
  const registry = new OpenAPIRegistry();
  for (const route of routes) {
    const request: Record<string, unknown> = {};
    if (route.request?.params) request.params = route.request.params;
    if (route.request?.query) request.query = route.request.query;
    if (route.request?.body) {
      request.body = { content: { 'application/json': { schema: route.request.body } } };
    }
    const responses = Object.fromEntries(
      Object.entries(route.responses).map(([status, response]) => {
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
  });
}
