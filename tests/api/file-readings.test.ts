import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { StudyUpload } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

const fixture = path.join(import.meta.dirname, '..', 'fixtures', 'uploads', 'series-comma-mM.csv');
let labId = '';
let researcher: Awaited<ReturnType<typeof apiClient>>;
let csrf = '';

beforeAll(async () => {
  const setup = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  labId = setup.lab.id;
  researcher = await apiClient(testApp.app);
  csrf = (await researcher.signIn(setup.users.researcher)).body.csrfToken;
});

describe('POST /api/labs/:labId/file-readings', () => {
  it('when a researcher sends an export before the study exists, then the preview comes back in the file’s units and nothing is kept', async () => {
    const before = await StudyUpload.count();
    const response = await researcher.agent
      .post(`/api/labs/${labId}/file-readings`)
      .set('x-csrf-token', csrf)
      .attach('file', fs.readFileSync(fixture), 'series-comma-mM.csv');
    expect(response.status).toBe(200);
    // tests/fixtures/uploads/README.md: [Q] in mM, I = 1000 / (1 + 500 [Q]).
    expect(response.body).toMatchObject({ fileName: 'series-comma-mM.csv', pointCount: 6 });
    expect(response.body.mapping).toMatchObject({ layout: 'series', concentrationUnit: 'mM' });
    expect(await StudyUpload.count()).toBe(before);
  });

  it('when the new study names an emission window, then the spectra are proposed over it, not over the whole range', async () => {
    // tests/fixtures/uploads/README.md: spectrum-matrix.csv covers 450-550 nm.
    const spectra = fs.readFileSync(path.join(import.meta.dirname, '..', 'fixtures', 'uploads', 'spectrum-matrix.csv'));
    const read = (fields: Record<string, string>) => {
      const request = researcher.agent.post(`/api/labs/${labId}/file-readings`).set('x-csrf-token', csrf);
      for (const [name, value] of Object.entries(fields)) void request.field(name, value);
      return request.attach('file', spectra, 'spectrum-matrix.csv');
    };
    const windowed = await read({ windowStart: '460', windowEnd: '540' });
    expect(windowed.status, JSON.stringify(windowed.body)).toBe(200);
    expect(windowed.body.mapping.reduction).toEqual({ kind: 'window', start: 460, end: 540 });
    const atOne = await read({ emissionWavelength: '505' });
    expect(atOne.body.mapping.reduction).toEqual({ kind: 'wavelength', at: 505 });
    const refused = await read({ windowStart: 'wide' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details[0].path).toBe('body.windowStart');
  });

  it('when the file is not one Halflight reads, then 415 names it and nothing is kept', async () => {
    const response = await researcher.agent
      .post(`/api/labs/${labId}/file-readings`)
      .set('x-csrf-token', csrf)
      .attach('file', Buffer.from('x'), 'notes.docx');
    expect(response.status).toBe(415);
    expect(response.body.error.message).toContain('notes.docx');
  });

  it('when the mapping field is not JSON, then 400 names the field instead of a server error', async () => {
    const response = await researcher.agent
      .post(`/api/labs/${labId}/file-readings`)
      .set('x-csrf-token', csrf)
      .field('mapping', '{not json')
      .attach('file', fs.readFileSync(fixture), 'series-comma-mM.csv');
    expect(response.status).toBe(400);
    expect(response.body.error.details[0].path).toBe('body.mapping');
  });
});
