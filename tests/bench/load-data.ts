/**
 * Invented studies for the load benchmark, added to the demo lab with one SQL statement
 * (generate_series): emitters, quenchers and owners taken round-robin from the lab's own
 * compounds and members, statuses, solvents and K_SV values spread deterministically,
 * updated_at spread over a year. List rows only (no points or fits): the read mix opens the
 * demo studies, which have both. Demo numbers only.
 */
export function generatedStudiesSql(): string {
  return `
WITH emitters AS (
  SELECT array_agg(id ORDER BY name) AS ids FROM compounds WHERE lab_id = $1 AND role_hint IN ('photocatalyst', 'both')
), quenchers AS (
  SELECT array_agg(id ORDER BY name) AS ids FROM compounds WHERE lab_id = $1 AND role_hint IN ('quencher', 'both')
), owners AS (
  SELECT array_agg(user_id ORDER BY user_id) AS ids FROM memberships WHERE lab_id = $1
)
INSERT INTO studies (
  id, lab_id, emitter_id, quencher_id, title, solvent_id, temperature, excitation_wavelength,
  emission_wavelength, atmosphere, degassing_method, tau0, data_kind, fit_model, notes, owner_id,
  status, revision, is_current, k_sv, kq, flagged, version, created_at, updated_at
)
SELECT gen_random_uuid(), $1,
  emitters.ids[1 + g % cardinality(emitters.ids)],
  quenchers.ids[1 + (g / 7) % cardinality(quenchers.ids)],
  'Generated titration ' || g || ' (invented)',
  (ARRAY['acetonitrile', 'dichloromethane', 'dmf', 'dmso', 'methanol', 'toluene'])[1 + g % 6],
  298.15, 450, 600, 'argon', 'sparging', 1e-6, 'intensity', 'linear-free',
  (ARRAY['amine screen', 'sulfide series', 'thiophenol', 'borate salt', 'aryl halide'])[1 + g % 5] || ' run ' || g,
  owners.ids[1 + g % cardinality(owners.ids)],
  ((ARRAY['draft', 'draft', 'submitted', 'approved', 'approved', 'returned'])[1 + g % 6])::enum_studies_status,
  1, true,
  CASE WHEN g % 9 = 0 THEN NULL ELSE 20 + (g * 7919 % 2000) END,
  CASE WHEN g % 9 = 0 THEN NULL ELSE (20 + (g * 7919 % 2000)) / 1e-6 END,
  g % 7 = 0, 0,
  now() - (g * 7919 % 525600) * interval '1 minute',
  now() - (g * 7919 % 525600) * interval '1 minute'
FROM generate_series(1, $2::int) AS g, emitters, quenchers, owners`;
}
