import { pointAt } from '@shared/schemas/study-points';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { apiClient } from './accounts';

type Client = Awaited<ReturnType<typeof apiClient>>;

/** A minimal valid study body with inline-named compounds (invented names per test). */
export const studyBody = (tag: string, extra: Record<string, unknown> = {}) => ({
  title: `Test study ${tag}`,
  newEmitterName: `TEST-Ir-${tag}`,
  newQuencherName: `TEST-amine-${tag}`,
  solventId: 'acetonitrile',
  atmosphere: 'argon',
  degassingMethod: 'sparging',
  tau0: 1e-6,
  tau0Uncertainty: 2e-8,
  ...extra,
});

/** Exact line I0/I = 1 + 500 [Q] (invented numbers; K_SV = 500 M^-1 by construction). */
export const exactPoints = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q) => ({
  ...pointAt(q),
  intensity: 1000 / (1 + 500 * q),
}));

export async function createStudy(client: Client, labId: string, tag: string, extra: Record<string, unknown> = {}) {
  const response = await client.post(`/api/labs/${labId}/studies`, studyBody(tag, extra));
  if (response.status !== 201) throw new Error(`create failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body as { id: string; version: number; emitter: { id: string }; quencher: { id: string } };
}

/**
 * `count` copies of the study `templateId` of lab `labId`, made in one INSERT … SELECT for list
 * tests that need many rows fast. `set` gives SQL expressions for the columns a test varies; `g`
 * (1 … count) numbers the copy. Every other column is the template's; each copy gets a new id.
 */
export async function copyStudyInSql(
  sequelize: Sequelize,
  options: { templateId: string; labId: string; count: number; set: Record<string, string> },
) {
  const varied = ['id', ...Object.keys(options.set)];
  const columns = (
    await sequelize.query<{ column_name: string }>(
      "SELECT column_name FROM information_schema.columns WHERE table_name = 'studies' AND table_schema = current_schema()",
      { type: QueryTypes.SELECT },
    )
  )
    .map((row) => row.column_name)
    .filter((name) => !varied.includes(name));
  const kept = columns.map((name) => `"${name}"`).join(', ');
  const names = varied.map((name) => `"${name}"`).join(', ');
  const values = ['gen_random_uuid()', ...Object.values(options.set)].join(', ');
  await sequelize.query(
    `INSERT INTO studies (${names}, ${kept})
     SELECT ${values}, ${kept}
     FROM studies, generate_series(1, $2::int) AS g WHERE studies.id = $1 AND studies.lab_id = $3`,
    { bind: [options.templateId, options.count, options.labId] },
  );
}
