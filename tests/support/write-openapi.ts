/**
 * Writes the OpenAPI document the server serves at /api/openapi.json to a file, for
 * `npm run lint:openapi` (Redocly CLI, recommended rules; part of `npm test`).
 */
import fs from 'node:fs';
import path from 'node:path';
import { buildOpenApiDocument } from '../../server/http/openapi';
import { appVersion } from '../../server/lib/version';
import { apiRoutes } from '../../server/routes';

const target = process.argv[2] ?? 'test-output/openapi.json';
fs.mkdirSync(path.dirname(target), { recursive: true });
fs.writeFileSync(target, JSON.stringify(buildOpenApiDocument(apiRoutes, appVersion), null, 2));
