import { readFileSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../config/env';

export const appVersion: string = (
  JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { version: string }
).version;
