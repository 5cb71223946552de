import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import ts from 'typescript';
import { beforeAll, describe, expect, it } from 'vitest';

// The layer rules of DEVELOPERS.md, checked the way a newcomer would break them: a probe file in the
// wrong place is linted (ESLint's API on fixture text, with the project's own config) and type-checked
// (the compiler API with the project's own tsconfig, the probe held in memory). Nothing is written.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

let eslint: ESLint;
beforeAll(() => {
  eslint = new ESLint({ cwd: root, overrideConfigFile: path.join(root, '.config/eslint.config.js') });
});

async function lintErrors(file: string, text: string) {
  const [result] = await eslint.lintText(text, { filePath: path.join(root, file) });
  return (result?.messages ?? []).filter((message) => message.severity === 2);
}

async function ruleHits(file: string, text: string) {
  return (await lintErrors(file, text)).map((message) => message.ruleId);
}

// Loading the lint config and the TypeScript libraries takes seconds on a busy machine; these are not timings.
describe('import boundaries (npm run lint)', { timeout: 60_000 }, () => {
  it('when shared/ imports server code, by alias-free relative path, then lint fails', async () => {
    expect(
      await ruleHits('shared/engine/probe.ts', "export { AppError } from '../../server/lib/app-error';\n"),
    ).toContain('boundaries/dependencies');
  });

  it('when shared/ imports client code, then lint fails', async () => {
    expect(await ruleHits('shared/schemas/probe.ts', "export { apiClient } from '@/lib/api-client';\n")).toEqual([
      'boundaries/dependencies',
    ]);
  });

  it('when shared/ imports a Node module or a server package, then lint fails', async () => {
    const hits = await ruleHits(
      'shared/engine/probe.ts',
      "import fs from 'node:fs';\nimport path from 'path';\nimport express from 'express';\nexport const x = [fs, path, express];\n",
    );
    expect(hits).toEqual(['boundaries/dependencies', 'boundaries/dependencies', 'boundaries/dependencies']);
  });

  it('when shared/ uses a browser or Node global, then lint fails', async () => {
    const hits = await ruleHits('shared/engine/probe.ts', 'export const x = [document.title, process.env, window];\n');
    expect(hits).toEqual(['no-restricted-globals', 'no-restricted-globals', 'no-restricted-globals']);
  });

  it('when shared/ uses zod or the engine packages, then lint passes', async () => {
    const text =
      "import { z } from 'zod';\nimport { levenbergMarquardt } from 'ml-levenberg-marquardt';\n" +
      'export const x = [z, levenbergMarquardt, Math.PI, new Map()];\n';
    expect(await lintErrors('shared/engine/probe.ts', text)).toEqual([]);
  });

  it('when the client imports server code, relatively or through an @server alias, then lint fails', async () => {
    expect(await ruleHits('src/lib/probe.ts', "export { AppError } from '../../server/lib/app-error';\n")).toEqual([
      'boundaries/dependencies',
    ]);
    expect(await ruleHits('src/routes/probe.ts', "export { createApp } from '@server/app';\n")).toContain(
      'no-restricted-imports',
    );
  });

  it('when one feature imports another, by alias or relatively, then lint fails', async () => {
    const byAlias = "export { libraryKeys } from '@/features/library/api/library-keys';\n";
    const relative = "export { libraryKeys } from '../../library/api/library-keys';\n";
    expect(await ruleHits('src/features/studies/api/probe.ts', byAlias)).toEqual(['boundaries/dependencies']);
    expect(await ruleHits('src/features/studies/api/probe.ts', relative)).toEqual(['boundaries/dependencies']);
  });

  it('when a feature imports its own files, shared UI and shared/, then lint passes', async () => {
    const text =
      "export { studyKeys } from '../api/studies-keys';\nexport { Button } from '@/components/button';\n" +
      "export { studyStatusSchema } from '@shared/schemas/studies';\n";
    expect(await lintErrors('src/features/studies/components/probe.ts', text)).toEqual([]);
  });

  it('when a service imports middleware, a route module or the http helpers, then lint fails', async () => {
    const text =
      "import { requireAuth } from '../middleware/access';\nimport { labOf } from '../http/request-context';\n" +
      "import { studyRoutes } from '../routes/studies.routes';\nexport const x = [requireAuth, labOf, studyRoutes];\n";
    expect(await ruleHits('server/services/probe.ts', text)).toEqual([
      'boundaries/dependencies',
      'boundaries/dependencies',
      'boundaries/dependencies',
    ]);
  });

  it('when the real modules that cross layers the allowed way are linted, then they pass', async () => {
    const results = await eslint.lintFiles([
      'src/routes/study.tsx',
      'src/App.tsx',
      'server/routes/studies.routes.ts',
      'server/services/studies/study.service.ts',
      'server/middleware/access.ts',
      'shared/engine/index.ts',
    ]);
    expect(results.flatMap((result) => result.messages.map((m) => `${result.filePath}: ${m.message}`))).toEqual([]);
  });
});

/** Type-checks one in-memory probe file as part of a project (src, server or shared). */
function typeErrorCodes(project: 'src' | 'server' | 'shared', file: string, text: string): number[] {
  const parsed = ts.getParsedCommandLineOfConfigFile(
    path.join(root, project, 'tsconfig.json'),
    {},
    {
      ...ts.sys,
      onUnRecoverableConfigFileDiagnostic: (diagnostic) => {
        throw new Error(ts.flattenDiagnosticMessageText(diagnostic.messageText, '\n'));
      },
    },
  );
  if (!parsed) throw new Error(`cannot read ${project}/tsconfig.json`);
  const probe = path.join(root, file);
  const host = ts.createCompilerHost(parsed.options);
  const { fileExists, readFile, getSourceFile } = host;
  host.fileExists = (name) => name === probe || fileExists(name);
  host.readFile = (name) => (name === probe ? text : readFile(name));
  host.getSourceFile = (name, language, ...rest) =>
    name === probe ? ts.createSourceFile(name, text, language) : getSourceFile(name, language, ...rest);
  const program = ts.createProgram({
    rootNames: [probe],
    options: parsed.options,
    projectReferences: parsed.projectReferences,
    host,
  });
  return ts.getPreEmitDiagnostics(program).map((diagnostic) => diagnostic.code);
}

describe('TypeScript projects (npm run typecheck runs tsc -b over all of them)', { timeout: 60_000 }, () => {
  it('when shared/ uses the DOM, Node globals or a Node module, then it does not compile', () => {
    const codes = typeErrorCodes(
      'shared',
      'shared/engine/probe.ts',
      "import fs from 'node:fs';\nexport const x = [fs, document.title, process.env];\n",
    );
    // 2307 cannot find module, 2584 DOM name without the DOM lib, 2591 Node name without Node types.
    expect(codes).toEqual(expect.arrayContaining([2307, 2584, 2591]));
  });

  it('when shared/ uses only ECMAScript, then it compiles', () => {
    expect(typeErrorCodes('shared', 'shared/engine/probe.ts', 'export const x = Math.hypot(3, 4);\n')).toEqual([]);
  });

  it('when shared/ reads an array element as if it were always there, then it does not compile', () => {
    // noUncheckedIndexedAccess: values[i] is number | undefined until the index is known to be in range.
    const unchecked = 'export const first = (values: number[]): number => values[0];\n';
    const checked = 'export const first = (values: number[]): number => values[0] ?? Number.NaN;\n';
    expect(typeErrorCodes('shared', 'shared/engine/probe.ts', unchecked)).toEqual([2322]);
    expect(typeErrorCodes('shared', 'shared/engine/probe.ts', checked)).toEqual([]);
  });

  it('when the client imports a server file or names @server, then it does not compile', () => {
    // 6307: the file is outside the client project and no referenced project holds it.
    expect(
      typeErrorCodes('src', 'src/lib/probe.ts', "export { AppError } from '../../server/lib/app-error';\n"),
    ).toContain(6307);
    expect(typeErrorCodes('src', 'src/lib/probe.ts', "export { createApp } from '@server/app';\n")).toContain(2307);
  });

  it('when the server uses the DOM, then it does not compile', () => {
    expect(typeErrorCodes('server', 'server/lib/probe.ts', 'export const x = document.title;\n')).toEqual(
      expect.arrayContaining([2584]),
    );
  });
});
