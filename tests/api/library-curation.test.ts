import { afterAll, describe, expect, it } from 'vitest';
import { AuditEvent, Compound } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

type Role = 'viewer' | 'researcher' | 'reviewer' | 'admin';
async function labWith(roles: Role[]) {
  const setup = await createLabWithMembers(testApp.sequelize, { roles });
  const clients = {} as Record<Role, Awaited<ReturnType<typeof apiClient>>>;
  for (const role of roles) {
    clients[role] = await apiClient(testApp.app);
    await clients[role].signIn(setup.users[role]);
  }
  return { labId: setup.lab.id, ...clients };
}

describe('GET /api/labs/:labId/compounds', () => {
  it('when the library is searched and filtered, then the page, the total and the role filter agree', async () => {
    const { labId, researcher, viewer } = await labWith(['researcher', 'viewer']);
    for (const [name, roleHint] of [
      ['HL-Ir-a', 'photocatalyst'],
      ['HL-Ir-b', 'both'],
      ['Q-amine-a', 'quencher'],
    ] as const) {
      expect((await researcher.post(`/api/labs/${labId}/compounds`, { name, roleHint })).status).toBe(201);
    }
    const emitters = await viewer.get(`/api/labs/${labId}/compounds?roleHint=photocatalyst`);
    expect(emitters.body.items.map((item: { name: string }) => item.name)).toEqual(['HL-Ir-a', 'HL-Ir-b']);
    const searched = await viewer.get(`/api/labs/${labId}/compounds?search=amine`);
    expect(searched.body).toMatchObject({ total: 1, items: [{ name: 'Q-amine-a' }] });
    const paged = await viewer.get(`/api/labs/${labId}/compounds?page=2&pageSize=2`);
    expect(paged.body).toMatchObject({ total: 3, page: 2, pageSize: 2, items: [{ name: 'Q-amine-a' }] });
    const pastTheEnd = await viewer.get(`/api/labs/${labId}/compounds?page=5&pageSize=2`);
    expect(pastTheEnd.body).toMatchObject({ total: 3, page: 5, items: [] });
    // A list item says what the compound's own page says about it (the list reads plain rows).
    const [listed] = searched.body.items;
    expect(listed.createdByName).toBeTruthy();
    expect((await viewer.get(`/api/labs/${labId}/compounds/${listed.id}`)).body).toMatchObject(listed);
    const again = await researcher.post(`/api/labs/${labId}/compounds`, { name: 'hl-ir-A', roleHint: 'quencher' });
    expect(again.status).toBe(409);
    expect(again.body.error.details[0].path).toBe('body.name');
  });
});

describe('PATCH /api/labs/:labId/compounds/:compoundId', () => {
  it('when another researcher edits, then 403; a reviewer curates it; an old version gets 409 stale_version', async () => {
    const { labId, researcher, reviewer } = await labWith(['researcher', 'reviewer']);
    const other = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const { Membership } = await import('../../server/models');
    await Membership.create({ labId, userId: other.users.researcher.id, role: 'researcher' });
    const stranger = await apiClient(testApp.app);
    await stranger.signIn(other.users.researcher);
    const created = (
      await researcher.post(`/api/labs/${labId}/compounds`, { name: 'HL-Cz-x', roleHint: 'photocatalyst' })
    ).body;
    const url = `/api/labs/${labId}/compounds/${created.id}`;
    expect((await stranger.patch(url, { notes: 'mine now', version: created.version })).status).toBe(403);
    const curated = await reviewer.patch(url, { notes: 'checked against the notebook', version: created.version });
    expect(curated.status).toBe(200);
    expect(curated.body).toMatchObject({ notes: 'checked against the notebook', version: created.version + 1 });
    const stale = await researcher.patch(url, { notes: 'late edit', version: created.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect((await researcher.get(url)).body.notes).toBe('checked against the notebook');
    const audit = await AuditEvent.findOne({ where: { labId, action: 'compound_changed' } });
    expect(audit?.details).toMatchObject({ from: { notes: '' }, to: { notes: 'checked against the notebook' } });
    expect((await researcher.delete(url)).status).toBe(403);
    expect((await reviewer.delete(`${url}?version=${created.version + 1}`)).status).toBe(204);
    expect((await reviewer.get(url)).status).toBe(404);
  });
});

describe('PATCH and DELETE /api/labs/:labId/compounds/:compoundId/lifetimes/:lifetimeId', () => {
  it('when the owner edits a lifetime with the current version, then it changes; a reviewer removes it', async () => {
    const { labId, researcher, reviewer } = await labWith(['researcher', 'reviewer']);
    const compound = (
      await researcher.post(`/api/labs/${labId}/compounds`, { name: 'HL-Ir-t', roleHint: 'photocatalyst' })
    ).body;
    const base = `/api/labs/${labId}/compounds/${compound.id}/lifetimes`;
    const lifetime = await researcher.post(base, {
      value: 1.1e-6,
      solvent: 'acetonitrile',
      atmosphere: 'argon',
      method: 'TCSPC',
    });
    expect(lifetime.status).toBe(201);
    expect(lifetime.body).toMatchObject({ value: 1.1e-6, temperature: 298.15, version: 0 });
    const changed = await researcher.patch(`${base}/${lifetime.body.id}`, { uncertainty: 2e-8, version: 0 });
    expect(changed.body).toMatchObject({ uncertainty: 2e-8, version: 1 });
    expect((await researcher.patch(`${base}/${lifetime.body.id}`, { uncertainty: 1e-8, version: 0 })).status).toBe(409);
    expect((await reviewer.delete(`${base}/${lifetime.body.id}`)).status).toBe(204);
    expect((await researcher.get(`/api/labs/${labId}/compounds/${compound.id}`)).body.lifetimes).toEqual([]);
  });
});

describe('GET and PATCH /api/labs/:labId/settings', () => {
  it('when an admin switches the display reference to Fc+/Fc, then potentials read against it, originals unchanged', async () => {
    const { labId, admin, viewer } = await labWith(['admin', 'viewer']);
    expect((await viewer.get(`/api/labs/${labId}/settings`)).body).toEqual({
      displayReference: 'SCE',
      displaySolvent: 'acetonitrile',
    });
    expect((await viewer.patch(`/api/labs/${labId}/settings`, { displayReference: 'Fc+/Fc' })).status).toBe(403);
    expect((await admin.patch(`/api/labs/${labId}/settings`, { displayReference: 'Hg/HgO' })).status).toBe(400);
    expect(
      (await admin.patch(`/api/labs/${labId}/settings`, { displayReference: 'Fc+/Fc' })).body.displayReference,
    ).toBe('Fc+/Fc');
    const compound = (await admin.post(`/api/labs/${labId}/compounds`, { name: 'HL-Ru-s', roleHint: 'photocatalyst' }))
      .body;
    const potential = await admin.post(`/api/labs/${labId}/compounds/${compound.id}/potentials`, {
      couple: 'oxidation',
      value: 1.29,
      reference: 'SCE',
      solvent: 'acetonitrile',
      kind: 'half-wave',
    });
    // 1.29 V vs SCE − 0.380 V (Pavlishchuk & Addison, Inorg. Chim. Acta 2000, 298, 97) = 0.91 V vs Fc+/Fc, the engine's own example.
    expect(potential.body.display).toMatchObject({ reference: 'Fc+/Fc' });
    expect(potential.body.display.value).toBeCloseTo(0.91, 6);
    expect(potential.body.value).toBe(1.29);
    expect(await AuditEvent.count({ where: { labId, action: 'lab_settings_changed' } })).toBe(1);
  });
});

describe('GET /api/labs/:labId/driving-force', () => {
  it('when both partners have potentials, then both pathways, the favoured one, the Coulomb term and what is missing are given', async () => {
    const { labId, researcher } = await labWith(['researcher']);
    const post = (url: string, body: object) => researcher.post(`/api/labs/${labId}${url}`, body);
    const emitter = (await post('/compounds', { name: 'Test-Ru', roleHint: 'photocatalyst', tripletEnergy: 2.1 })).body;
    const quencher = (await post('/compounds', { name: 'Test-Rh', roleHint: 'quencher', tripletEnergy: 2.3 })).body;
    const base = { reference: 'SCE', solvent: 'acetonitrile', kind: 'half-wave' };
    // Inorg. Chem. 2023, 62, 7636 (PMC10207326) Table 2: E*ox(Ru(bpy)3) = −0.81 V,
    // E_red(acceptor) = −0.74 V vs SCE, dG = −0.07 eV. Entered as E(PC+/PC) +1.29 V and E00 2.10 eV (Prier 2013, §5).
    await post(`/compounds/${emitter.id}/potentials`, { ...base, couple: 'oxidation', value: 1.29 });
    await post(`/compounds/${emitter.id}/energies`, { value: 2.1, method: 'review value' });
    await post(`/compounds/${quencher.id}/potentials`, { ...base, couple: 'reduction', value: -0.74 });
    const response = await researcher.get(
      `/api/labs/${labId}/driving-force?emitterId=${emitter.id}&quencherId=${quencher.id}&solvent=acetonitrile&pinned=reductive`,
    );
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const result = response.body;
    expect(result.oxidative.electronvolts).toBeCloseTo(-0.07, 6);
    // 1 eV = 96.485 kJ/mol (CODATA 2018 e·N_A).
    expect(result.oxidative.kilojoulesPerMole).toBeCloseTo(-0.07 * 96.485, 2);
    // Neutral pair in MeCN (eps 35.69) at 7 Å: w = −14.3996/(35.69·7) = −0.058 eV (computed with e^2/(4 pi eps0) = 14.3996 eV Å, CODATA 2018).
    expect(result.oxidative.workTerm).toBeCloseTo(-0.058, 3);
    expect(result.oxidative.withWorkTerm).toBeCloseTo(-0.128, 3);
    expect(result.reductive).toBeNull();
    // Pinned reductive cannot be computed, so the favoured oxidative route stays highlighted.
    expect(result).toMatchObject({ favoured: 'oxidative', highlighted: 'oxidative', pinned: 'reductive' });
    // Rule: transfer is downhill only when the quencher's triplet lies below the catalyst's (Turro 2010, from memory).
    expect(result.energyTransfer).toMatchObject({ possible: false });
    expect(result.energyTransfer.energyDifference).toBeCloseTo(0.2, 6);
    const missing = result.missing.map(
      (item: { compoundName: string; quantity: string }) => `${item.compoundName}:${item.quantity}`,
    );
    expect(missing.sort()).toEqual(['Test-Rh:oxidation', 'Test-Ru:reduction']);
    const lone = (await post('/compounds', { name: 'Test-lone', roleHint: 'quencher' })).body;
    const nothing = await researcher.get(
      `/api/labs/${labId}/driving-force?emitterId=${lone.id}&quencherId=${quencher.id}&solvent=acetonitrile`,
    );
    expect(nothing.body).toMatchObject({ oxidative: null, reductive: null, favoured: null });
    expect(
      nothing.body.missing.some(
        (item: { quantity: string; compoundName: string }) =>
          item.quantity === 'e00' && item.compoundName === 'Test-lone',
      ),
    ).toBe(true);
  });
});

describe('CSV import and export', () => {
  const header =
    'record,compound,role_hint,couple,potential_v,reference,kind,solvent,lifetime_s,atmosphere,method,e00_ev,notes';
  it('when one row of the file is bad, then nothing is saved and the row and column are reported', async () => {
    const { labId, researcher } = await labWith(['researcher']);
    const csv = [
      header,
      'compound,CSV-Ir-1,photocatalyst,,,,,,,,,,',
      'potential,CSV-Ir-1,,oxidation,1.21,SCE,half-wave,acetonitrile,,,,,',
      'potential,CSV-Ir-1,,reduction,minus one,SCE,half-wave,acetonitrile,,,,,',
    ].join('\n');
    const response = await researcher.post(`/api/labs/${labId}/compounds/import`, { csv });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('import_invalid');
    expect(response.body.error.details).toEqual([
      { path: 'csv.row4.potential_v', message: 'must be a number in volts' },
    ]);
    expect(await Compound.count({ where: { labId } })).toBe(0);
    const dry = await researcher.post(`/api/labs/${labId}/compounds/import`, { csv, dryRun: true });
    expect(dry.body).toMatchObject({ saved: false, problems: [{ row: 4, column: 'potential_v' }] });
  });

  it('when a valid file is imported and exported, then every record arrives and formula-like cells are neutralised', async () => {
    const { labId, researcher } = await labWith(['researcher']);
    const csv = [
      header,
      'compound,CSV-Ir-2,photocatalyst,,,,,,,,,,"=HYPERLINK(""x"")"',
      'potential,CSV-Ir-2,,oxidation,0.84,Fc+/Fc,half-wave,acetonitrile,,,,,',
      'lifetime,CSV-Ir-2,,,,,,acetonitrile,1.2e-6,argon,TCSPC,,',
      'e00,CSV-Ir-2,,,,,,,,,emission onset,2.5,',
    ].join('\n');
    const saved = await researcher.post(`/api/labs/${labId}/compounds/import`, { csv });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.counts).toEqual({ compounds: 1, potentials: 1, lifetimes: 1, energies: 1 });
    const exported = await researcher.get(`/api/labs/${labId}/compounds/export.csv`);
    expect(exported.headers['content-type']).toMatch(/text\/csv/);
    expect(exported.text).toContain(`"'=HYPERLINK(""x"")"`);
    expect(exported.text).toContain('potential,CSV-Ir-2');
    const { labId: otherLab, researcher: other } = await labWith(['researcher']);
    const roundTrip = await other.post(`/api/labs/${otherLab}/compounds/import`, { csv: exported.text });
    expect(roundTrip.status, JSON.stringify(roundTrip.body)).toBe(201);
    const list = await other.get(`/api/labs/${otherLab}/compounds`);
    expect(list.body.items[0]).toMatchObject({
      name: 'CSV-Ir-2',
      notes: '=HYPERLINK("x")',
      counts: { potentials: 1, lifetimes: 1, energies: 1 },
    });
  });
});
