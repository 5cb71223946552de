import { pointAt } from '@shared/schemas/study-points';
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
