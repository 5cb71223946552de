import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

// Every text field of every route, taken from the OpenAPI document, gets a NUL and a lone
// surrogate in turn; the answer must be 400 naming that field, never 500 and never a silent
// rewrite. PostgreSQL refuses both characters in text and JSONB (PostgreSQL manual, 8.3
// "Character Types": the character with code zero cannot be stored).
const testApp = await createTestApp();
type Client = Awaited<ReturnType<typeof apiClient>>;
let admin: Client;
let labId = '';

interface Schema {
  $ref?: string;
  type?: string | string[];
  format?: string;
  enum?: unknown[];
  const?: unknown;
  properties?: Record<string, Schema>;
  required?: string[];
  items?: Schema;
  anyOf?: Schema[];
  oneOf?: Schema[];
  allOf?: Schema[];
  minimum?: number;
  exclusiveMinimum?: number;
  maximum?: number;
  minLength?: number;
  minItems?: number;
  additionalProperties?: Schema | boolean;
}
interface Operation {
  parameters?: Array<{ in: string; name: string; schema?: Schema }>;
  requestBody?: { content: Record<string, { schema: Schema }> };
}
let components: Record<string, Schema> = {};
let paths: Record<string, Record<string, Operation>> = {};

beforeAll(async () => {
  const { users, lab } = await createLabWithMembers(testApp.sequelize, { roles: ['admin'] });
  labId = lab.id;
  admin = await apiClient(testApp.app);
  await admin.signIn(users.admin);
  const document = (await admin.get('/api/openapi.json').expect(200)).body;
  components = document.components?.schemas ?? {};
  paths = document.paths;
});
afterAll(testApp.close);

const resolve = (schema: Schema): Schema =>
  schema.$ref ? resolve(components[schema.$ref.replace('#/components/schemas/', '')]!) : schema;
const types = (schema: Schema) => (Array.isArray(schema.type) ? schema.type : schema.type ? [schema.type] : []);
const branches = (schema: Schema) =>
  (schema.anyOf ?? schema.oneOf ?? []).map(resolve).filter((branch) => !types(branch).includes('null'));

/** A plain value the schema accepts where that is easy to make; exactness does not matter here. */
function example(given: Schema): unknown {
  const schema = resolve(given);
  if (schema.const !== undefined) return schema.const;
  if (schema.enum) return schema.enum[0];
  if (schema.allOf) return Object.assign({}, ...schema.allOf.map(example));
  if (branches(schema).length) return example(branches(schema)[0]!);
  const [type] = types(schema).filter((name) => name !== 'null');
  if (type === 'object' || schema.properties) {
    return Object.fromEntries((schema.required ?? []).map((key) => [key, example(schema.properties?.[key] ?? {})]));
  }
  if (type === 'array') return Array.from({ length: schema.minItems ?? 0 }, () => example(schema.items ?? {}));
  if (type === 'integer' || type === 'number') {
    const low = schema.minimum ?? (schema.exclusiveMinimum !== undefined ? schema.exclusiveMinimum + 1 : 1);
    return Math.min(Math.max(low, 1), schema.maximum ?? Number.MAX_SAFE_INTEGER);
  }
  if (type === 'boolean') return false;
  if (type === 'string') {
    if (schema.format === 'uuid') return crypto.randomUUID();
    if (schema.format === 'email') return `text-${crypto.randomBytes(3).toString('hex')}@tests.halflight.example`;
    if (schema.format === 'date-time') return new Date().toISOString();
    return 'x'.repeat(Math.max(schema.minLength ?? 1, 12));
  }
  return null;
}

/** Paths to every string in the schema (enums and constants are not typed text). */
function textPaths(given: Schema, prefix: Array<string | number> = [], depth = 0): Array<Array<string | number>> {
  const schema = resolve(given);
  if (depth > 6 || schema.enum || schema.const !== undefined) return [];
  const found: Array<Array<string | number>> = [];
  for (const part of [...(schema.allOf ?? []), ...branches(schema)]) found.push(...textPaths(part, prefix, depth + 1));
  // Formatted strings (ids, e-mail addresses, dates) are typed text too: they must fail the same way.
  if (types(schema).includes('string')) found.push(prefix);
  for (const [key, property] of Object.entries(schema.properties ?? {})) {
    found.push(...textPaths(property, [...prefix, key], depth + 1));
  }
  if (schema.items) found.push(...textPaths(schema.items, [...prefix, 0], depth + 1));
  const seen = new Set<string>();
  return found.filter((path) => !seen.has(path.join('.')) && seen.add(path.join('.')));
}

function withValueAt(base: unknown, path: Array<string | number>, value: string): unknown {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  const container = (base ?? (typeof head === 'number' ? [] : {})) as Record<string | number, unknown>;
  const copy = (Array.isArray(container) ? [...container] : { ...container }) as Record<string | number, unknown>;
  copy[head!] = withValueAt(container[head!], rest, value);
  return copy;
}

const poisons = { NUL: 'left\u0000right', 'lone surrogate': 'left\uD800right' };

describe('text fields on every route', () => {
  it('when any text field holds NUL or a lone surrogate, then the answer is 400 naming that field', async () => {
    const failures: string[] = [];
    let fieldsTried = 0;
    const routesTried = new Set<string>();
    for (const [template, operations] of Object.entries(paths)) {
      for (const [method, operation] of Object.entries(operations)) {
        const body = operation.requestBody?.content['application/json']?.schema;
        const targets: Array<{ part: 'body' | 'query' | 'params'; path: Array<string | number> }> = [];
        if (body) targets.push(...textPaths(body).map((path) => ({ part: 'body' as const, path })));
        for (const parameter of operation.parameters ?? []) {
          if (parameter.in === 'query' && parameter.schema && textPaths(parameter.schema).length) {
            targets.push({ part: 'query', path: [parameter.name] });
          }
          // The lab guard answers an id that is not a lab's with 404 before anything else runs.
          if (parameter.in === 'path' && parameter.name !== 'labId')
            targets.push({ part: 'params', path: [parameter.name] });
        }
        for (const target of targets) {
          for (const [poisonName, poison] of Object.entries(poisons)) {
            // A lone surrogate has no UTF-8 form, so it cannot travel in a URL; JSON carries it as \uD800.
            if (target.part !== 'body' && poisonName === 'lone surrogate') continue;
            fieldsTried++;
            routesTried.add(`${method} ${template}`);
            const named = `${target.part}.${target.path.join('.')}`;
            const url = template.replace(/\{(\w+)\}/g, (_all, name: string) =>
              target.part === 'params' && name === target.path[0]
                ? encodeURIComponent(poison)
                : name === 'labId'
                  ? labId
                  : crypto.randomUUID(),
            );
            const query = target.part === 'query' ? `?${target.path[0]}=${encodeURIComponent(poison)}` : '';
            const payload = target.part === 'body' ? withValueAt(example(body!), target.path, poison) : undefined;
            const call = admin[method as 'post' | 'put' | 'patch' | 'delete' | 'get'];
            const response = await call(`${url}${query}`, payload as object);
            const details = (response.body?.error?.details ?? []) as Array<{ path: string; message: string }>;
            if (response.status !== 400 || !details.some((detail) => detail.path === named)) {
              failures.push(`${method.toUpperCase()} ${template} ${named} (${poisonName}): ${response.status}`);
            }
          }
        }
      }
    }
    expect(failures).toEqual([]);
    // The document really was walked: most routes take an id, a query or a body with text.
    expect(routesTried.size).toBeGreaterThan(50);
    expect(fieldsTried).toBeGreaterThan(200);
  });

  it('when a new display name holds NUL, then it is refused and the name stays as it was (it used to be rewritten to a backslash and 0)', async () => {
    const before = (await admin.get('/api/session').expect(200)).body.user.name as string;
    const response = await admin.patch('/api/account', { name: 'Ada\u0000Lovelace' });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([{ path: 'body.name', message: expect.stringMatching(/NUL/) }]);
    expect((await admin.get('/api/session').expect(200)).body.user.name).toBe(before);
  });

  it('when a field holds well-formed text with emoji and accents, then it is stored as sent', async () => {
    const name = `Ir(ppy)₃ 🧪 données μM ${crypto.randomBytes(3).toString('hex')}`;
    const created = await admin.post(`/api/labs/${labId}/compounds`, { name, roleHint: 'photocatalyst' });
    expect(created.status).toBe(201);
    expect(created.body.name).toBe(name);
  });
});
