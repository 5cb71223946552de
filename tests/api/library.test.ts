import { afterAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

type Role = 'viewer' | 'researcher' | 'reviewer' | 'admin';
async function labWith(roles: Role[] = ['researcher']) {
  const setup = await createLabWithMembers(testApp.sequelize, { roles });
  const clients = {} as Record<Role, Awaited<ReturnType<typeof apiClient>>>;
  for (const role of roles) {
    clients[role] = await apiClient(testApp.app);
    await clients[role].signIn(setup.users[role]);
  }
  return { labId: setup.lab.id, ...clients };
}

async function addCompound(client: Awaited<ReturnType<typeof apiClient>>, labId: string, body: object) {
  const response = await client.post(`/api/labs/${labId}/compounds`, body);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body as { id: string; version: number };
}

describe('POST /api/labs/:labId/compounds/:compoundId/potentials', () => {
  it('when a potential is entered against Fc+/Fc in acetonitrile, then it reads 0.380 V higher against SCE, original kept', async () => {
    const { labId, researcher } = await labWith();
    const compound = await addCompound(researcher, labId, { name: 'Test-Fc-1', roleHint: 'photocatalyst' });
    const added = await researcher.post(`/api/labs/${labId}/compounds/${compound.id}/potentials`, {
      couple: 'oxidation',
      value: 0.92,
      reference: 'Fc+/Fc',
      solvent: 'acetonitrile',
      kind: 'half-wave',
      source: 'doi:10.0000/test',
    });
    expect(added.status, JSON.stringify(added.body)).toBe(201);
    // Fc+/Fc vs SCE in MeCN = +0.380 V: Pavlishchuk & Addison, Inorg. Chim. Acta 2000, 298, 97.
    // Cross-check: Ru(bpy)3 3+/2+ +0.92 V vs Fc (JACS 2023) ↔ +1.29 V vs SCE (Prier 2013), ±0.01 V.
    expect(added.body.display.value).toBeCloseTo(1.3, 6);
    expect(Math.abs(added.body.display.value - 1.29)).toBeLessThanOrEqual(0.011);
    expect(added.body).toMatchObject({
      value: 0.92,
      reference: 'Fc+/Fc',
      source: 'doi:10.0000/test',
      display: { reference: 'SCE' },
    });
    // Crossing from a non-aqueous to an aqueous reference carries the engine's junction-potential warning.
    expect(added.body.display.warnings.map((warning: { code: string }) => warning.code)).toContain(
      'JUNCTION_POTENTIAL',
    );
    const detail = await researcher.get(`/api/labs/${labId}/compounds/${compound.id}`);
    expect(detail.body.potentials).toHaveLength(1);
    expect(detail.body.potentials[0].value).toBe(0.92);
    expect(await AuditEvent.count({ where: { labId, action: 'potential_added' } })).toBe(1);
  });

  it('when a potential is entered against Ag/AgCl (sat. KCl), then it reads 0.044 V lower against SCE', async () => {
    const { labId, researcher } = await labWith();
    const compound = await addCompound(researcher, labId, { name: 'Test-AgCl-1', roleHint: 'quencher' });
    const added = await researcher.post(`/api/labs/${labId}/compounds/${compound.id}/potentials`, {
      couple: 'reduction',
      value: -1.0,
      reference: 'Ag/AgCl (sat. KCl)',
      solvent: 'water',
      kind: 'half-wave',
    });
    // SCE − Ag/AgCl(sat) = 0.2412 − 0.197 = 0.044 V (Bard & Faulkner, Electrochemical Methods, 2nd ed., table of reference electrodes; computed).
    expect(added.body.display.value).toBeCloseTo(-1.044, 3);
    expect(added.body.display.warnings).toEqual([]);
  });

  it('when the reference electrode is unknown or the value is not a number, then 400 names the field and nothing is saved', async () => {
    const { labId, researcher } = await labWith();
    const compound = await addCompound(researcher, labId, { name: 'Test-bad-1', roleHint: 'quencher' });
    const url = `/api/labs/${labId}/compounds/${compound.id}/potentials`;
    const good = { couple: 'oxidation', value: 1.1, reference: 'SCE', solvent: 'acetonitrile', kind: 'peak' };
    const unknown = await researcher.post(url, { ...good, reference: 'Hg/HgO' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details[0].path).toBe('body.reference');
    const text = await researcher.post(url, { ...good, value: 'about one volt' });
    expect(text.status).toBe(400);
    expect(text.body.error.details).toEqual([{ path: 'body.value', message: 'must be a number in volts' }]);
    expect((await researcher.get(`/api/labs/${labId}/compounds/${compound.id}`)).body.potentials).toEqual([]);
  });
});

describe('GET /api/labs/:labId/compounds/:compoundId (excited-state potentials)', () => {
  it('when 4CzIPN’s literature row is entered, then E* comes out of the ground-state potentials and E00 (±0.01 V)', async () => {
    const { labId, researcher } = await labWith();
    const compound = await addCompound(researcher, labId, { name: 'Test-4CzIPN-lit', roleHint: 'photocatalyst' });
    const url = `/api/labs/${labId}/compounds/${compound.id}`;
    // PMC6050529 Table 1 row "4a(lit)", MeCN, V vs SCE: E(PC+/PC) +1.52, E(PC/PC-) −1.21, E00 2.56 eV,
    // E*(PC+/PC*) −1.04, E*(PC*/PC-) +1.35 (PMC6050529, 4CzIPN literature row, as in tests/unit/engine/electrochem.test.ts).
    const base = { reference: 'SCE', solvent: 'acetonitrile', kind: 'half-wave', source: 'PMC6050529 Table 1' };
    await researcher.post(`${url}/potentials`, { ...base, couple: 'oxidation', value: 1.52 });
    await researcher.post(`${url}/potentials`, { ...base, couple: 'reduction', value: -1.21 });
    expect(
      (await researcher.post(`${url}/energies`, { value: 2.56, method: 'absorption/emission crossing' })).status,
    ).toBe(201);
    const { excitedState } = (await researcher.get(url)).body;
    expect(Math.abs(excitedState.excitedOxidation - -1.04)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(excitedState.excitedReduction - 1.35)).toBeLessThanOrEqual(0.01);
    expect(excitedState.e00.value).toBe(2.56);
    expect(excitedState.oxidation.original).toMatchObject({ value: 1.52, reference: 'SCE' });
    expect(excitedState.missing).toEqual([]);
  });

  it('when the Pt(II) row of PMC5811153 is entered with E_T from a wavelength, then E00 and E* match the table (±0.01 V)', async () => {
    const { labId, researcher } = await labWith();
    const compound = await addCompound(researcher, labId, { name: 'Test-Ptppy', roleHint: 'photocatalyst' });
    const url = `/api/labs/${labId}/compounds/${compound.id}`;
    // Chem. Sci. 2015, 6, 1454 (PMC5811153) Table 1, Ptppy: +0.57; −2.38; E_T 2.64; E* −2.07; +0.26 V vs SCE, MeCN.
    const base = { reference: 'SCE', solvent: 'acetonitrile', kind: 'half-wave' };
    await researcher.post(`${url}/potentials`, { ...base, couple: 'oxidation', value: 0.57 });
    await researcher.post(`${url}/potentials`, { ...base, couple: 'reduction', value: -2.38 });
    // 1239.84198 / 469.6 nm = 2.640 eV (CODATA hc/e), the table's 2.64 eV entered as a wavelength.
    const energy = await researcher.post(`${url}/energies`, { wavelength: 469.6, method: 'phosphorescence onset' });
    expect(energy.body.value).toBeCloseTo(2.64, 3);
    expect(energy.body.wavelength).toBe(469.6);
    const { excitedState } = (await researcher.get(url)).body;
    expect(Math.abs(excitedState.excitedOxidation - -2.07)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(excitedState.excitedReduction - 0.26)).toBeLessThanOrEqual(0.01);
  });

  it('when a wavelength lies outside 200–1500 nm, then 400 names body.wavelength', async () => {
    const { labId, researcher } = await labWith();
    const compound = await addCompound(researcher, labId, { name: 'Test-wl', roleHint: 'photocatalyst' });
    for (const wavelength of [150, 1600]) {
      const response = await researcher.post(`/api/labs/${labId}/compounds/${compound.id}/energies`, {
        wavelength,
        method: 'x',
      });
      expect(response.status).toBe(400);
      expect(response.body.error.details[0].path).toBe('body.wavelength');
    }
    expect((await researcher.get(`/api/labs/${labId}/compounds/${compound.id}`)).body.energies).toEqual([]);
  });
});

describe('POST /api/labs/:labId/compounds/import', () => {
  it('when the file is ";"-separated with decimal commas, then the numbers are read as written and saved', async () => {
    const { labId, researcher } = await labWith();
    // As a spreadsheet with German regional settings saves it (common practice: ';' between cells, ',' as decimal sign).
    const csv = [
      'record;compound;role_hint;couple;potential_v;reference;kind;solvent;lifetime_s;atmosphere;method;electrolyte',
      'compound;Semi-Ir-1;photocatalyst;;;;;;;;;',
      'potential;Semi-Ir-1;;oxidation;1,21;SCE;half-wave;acetonitrile;;;;0,1 M Bu4NPF6',
      'lifetime;Semi-Ir-1;;;;;;acetonitrile;1,9e-6;argon;TCSPC;',
    ].join('\r\n');
    const saved = await researcher.post(`/api/labs/${labId}/compounds/import`, { csv });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body).toMatchObject({ saved: true, counts: { compounds: 1, potentials: 1, lifetimes: 1 } });
    const [item] = (await researcher.get(`/api/labs/${labId}/compounds?search=Semi-Ir-1`)).body.items;
    const compound = (await researcher.get(`/api/labs/${labId}/compounds/${item.id}`)).body;
    expect(compound.potentials[0]).toMatchObject({ value: 1.21, reference: 'SCE', electrolyte: '0,1 M Bu4NPF6' });
    expect(compound.lifetimes[0].value).toBe(1.9e-6);

    // Grouped thousands are not a decimal comma: the cell stays text and the row is reported.
    const grouped = csv.replace('1,21', '1.210,5').replaceAll('Semi-Ir-1', 'Semi-Ir-2');
    const refused = await researcher.post(`/api/labs/${labId}/compounds/import`, { csv: grouped, dryRun: true });
    expect(refused.body.problems).toEqual([expect.objectContaining({ row: 3, column: 'potential_v' })]);
  });
});
