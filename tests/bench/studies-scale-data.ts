import type { Sequelize } from 'sequelize';

export interface BenchLab {
  labId: string;
  emitterId: string;
  quencherId: string;
  ownerId: string;
  studies: number;
}

/**
 * Invented studies at scale, made in PostgreSQL with generate_series (no row travels through
 * Node): `labs` labs of `perLab` studies each plus one lab of `bigLab` studies, each lab with 20
 * emitters and 60 quenchers of its own, 8 owners shared by all, statuses, solvents, K_SV and
 * flags spread deterministically, updated_at spread over a year; then VACUUM ANALYZE, as
 * autovacuum would after a bulk load. Returns a typical lab and the big one. Demo numbers only.
 */
export async function seedScaleStudies(
  sequelize: Sequelize,
  options: { labs: number; perLab: number; bigLab: number; log: (line: string) => void },
): Promise<{ typical: BenchLab; big: BenchLab; total: number }> {
  const q = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements });
  await q(`INSERT INTO users (id, email, name, password_hash, created_at, updated_at)
    SELECT gen_random_uuid(), 'scale-owner-' || g || '@example.invalid', 'Bench person ' || g, 'not-a-login', now(), now()
    FROM generate_series(1, 8) AS g`);
  await q(
    `INSERT INTO labs (id, name, slug, is_demo, created_at, updated_at)
    SELECT gen_random_uuid(), 'Scale bench lab ' || g || ' (invented)', 'scale-' || g, false, now(), now()
    FROM generate_series(0, :labs) AS g`,
    { labs: options.labs },
  );
  await q(`INSERT INTO compounds (id, lab_id, name, role_hint, notes, version, charge, created_at, updated_at)
    SELECT gen_random_uuid(), labs.id,
      CASE WHEN g <= 20 THEN 'HL-Ir-' || g ELSE 'HL-Q-' || (g - 20) END,
      (CASE WHEN g <= 20 THEN 'photocatalyst' ELSE 'quencher' END)::enum_compounds_role_hint,
      '', 0, 0, now(), now()
    FROM labs, generate_series(1, 80) AS g WHERE labs.slug LIKE 'scale-%'`);
  const insertStudies = (where: string, count: number) =>
    q(
      `WITH owners AS (SELECT array_agg(id ORDER BY email) AS ids FROM users WHERE email LIKE 'scale-owner-%'),
      picks AS (
        SELECT lab_id,
          array_agg(id ORDER BY name) FILTER (WHERE role_hint = 'photocatalyst') AS emitters,
          array_agg(id ORDER BY name) FILTER (WHERE role_hint = 'quencher') AS quenchers
        FROM compounds WHERE lab_id IN (SELECT id FROM labs WHERE ${where}) GROUP BY lab_id
      )
      INSERT INTO studies (
        id, lab_id, emitter_id, quencher_id, title, solvent_id, temperature, excitation_wavelength,
        emission_wavelength, atmosphere, degassing_method, tau0, data_kind, fit_model, notes, owner_id,
        status, revision, is_current, k_sv, kq, flagged, version, created_at, updated_at
      )
      SELECT gen_random_uuid(), picks.lab_id,
        picks.emitters[1 + g % 20], picks.quenchers[1 + (g * 7) % 60],
        'Bench titration ' || g || ' (invented)',
        (ARRAY['acetonitrile', 'dichloromethane', 'dmf', 'dmso', 'methanol', 'toluene'])[1 + (g * 5) % 6],
        298.15, 450, 600, 'argon', 'sparging', 1e-6, 'intensity', 'linear-free',
        (ARRAY['amine screen', 'sulfide series', 'thiophenol', 'borate salt', 'aryl halide', 'enamine', 'silicate'])[1 + (g * 5) % 7]
          || ' run ' || (100 + g % 900),
        owners.ids[1 + (g * 11) % 8],
        ((ARRAY['draft', 'draft', 'submitted', 'approved', 'approved', 'returned'])[1 + (g * 13) % 6])::enum_studies_status,
        1, true,
        CASE WHEN g % 11 = 0 THEN NULL ELSE 20 + (g * 7919) % 2000 END,
        CASE WHEN g % 11 = 0 THEN NULL ELSE (20 + (g * 7919) % 2000) / 1e-6 END,
        (g * 17) % 100 < 15, 0,
        now() - ((g::bigint * 104729) % 525600) * interval '1 minute',
        now() - ((g::bigint * 104729) % 525600) * interval '1 minute'
      FROM picks, owners, generate_series(1, :count) AS g`,
      { count },
    );
  const started = performance.now();
  const chunk = 100;
  for (let first = 1; first <= options.labs; first += chunk) {
    const last = Math.min(options.labs, first + chunk - 1);
    await insertStudies(`slug IN (SELECT 'scale-' || n FROM generate_series(${first}, ${last}) AS n)`, options.perLab);
    options.log(
      `  ${(last * options.perLab).toLocaleString('en-US')} studies in ${last} labs (${((performance.now() - started) / 1000).toFixed(0)} s)`,
    );
  }
  await insertStudies(`slug = 'scale-0'`, options.bigLab);
  options.log(
    `  + ${options.bigLab.toLocaleString('en-US')} in the big lab (${((performance.now() - started) / 1000).toFixed(0)} s)`,
  );
  await q('VACUUM ANALYZE studies');
  await q('VACUUM ANALYZE compounds');

  return scaleLabs(sequelize, options);
}

type Sizes = { labs: number; perLab: number; bigLab: number };

async function scaleLabs(
  sequelize: Sequelize,
  options: Sizes,
): Promise<{ typical: BenchLab; big: BenchLab; total: number }> {
  const q = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements });
  const labOf = async (slug: string, studies: number): Promise<BenchLab> => {
    const [rows] = (await q(
      `SELECT labs.id AS "labId",
        (SELECT id FROM compounds WHERE lab_id = labs.id AND name = 'HL-Ir-1') AS "emitterId",
        (SELECT id FROM compounds WHERE lab_id = labs.id AND name = 'HL-Q-1') AS "quencherId",
        (SELECT id FROM users WHERE email = 'scale-owner-1@example.invalid') AS "ownerId"
       FROM labs WHERE slug = :slug`,
      { slug },
    )) as [Array<Omit<BenchLab, 'studies'>>, unknown];
    return { ...rows[0]!, studies };
  };
  return {
    typical: await labOf(`scale-${Math.ceil(options.labs / 2)}`, options.perLab),
    big: await labOf('scale-0', options.bigLab),
    total: options.labs * options.perLab + options.bigLab,
  };
}

/**
 * The labs seedScaleStudies made earlier in this database (a kept bench cluster), analysed again,
 * when they have the sizes asked for; undefined when the database holds none (a set of other sizes,
 * or one left half made, stops seedScaleStudies at its users: delete the folder to start over).
 */
export async function seededScaleStudies(
  sequelize: Sequelize,
  options: Sizes,
): Promise<{ typical: BenchLab; big: BenchLab; total: number } | undefined> {
  const [rows] = (await sequelize.query(
    `SELECT count(*) FILTER (WHERE l.slug <> 'scale-0')::int AS labs,
       (SELECT count(*)::int FROM studies s WHERE s.lab_id = (SELECT id FROM labs WHERE slug = 'scale-0')) AS big,
       (SELECT count(*)::int FROM studies s WHERE s.lab_id = (SELECT id FROM labs WHERE slug = 'scale-1')) AS "perLab"
     FROM labs l WHERE l.slug LIKE 'scale-%'`,
  )) as [Array<{ labs: number; big: number; perLab: number }>, unknown];
  const found = rows[0];
  if (!found || found.labs !== options.labs || found.big !== options.bigLab || found.perLab !== options.perLab) {
    return undefined;
  }
  await sequelize.query('ANALYZE studies');
  return scaleLabs(sequelize, options);
}
