import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { DecaySet } from '@shared/schemas/decays';
import { DecaysPanel } from '@/features/decays/components/decays-panel';
import { answerFetch, errorAnswer, renderWithClient } from './support/render';
import { labId, studyDetail } from './support/study-fixture';

// Only the parts a kept set shows without its curves; the rest of a kept set does not matter here.
const set = {
  id: 'set-1',
  title: 'decays.csv',
  format: 'CSV',
  file: { id: 'file-1', fileName: 'decays.csv' },
  responseFile: null,
  outcomes: [{ index: 0, label: 'd1', concentration: null, lifetime: null, fit: null, problem: 'Not fitted.' }],
  sternVolmer: null,
  sternVolmerProblem: 'one decay only',
} as unknown as DecaySet;

describe('DecaysPanel (a study’s kept decay sets)', () => {
  it('when a kept decay cannot be drawn, then the reason takes the plot’s place instead of "Drawing…"', async () => {
    const study = studyDetail();
    const calls = answerFetch(
      { items: [set] },
      errorAnswer(503, 'file_store_unavailable', 'The kept file cannot be read just now.', []),
    );
    renderWithClient(
      <DecaysPanel labId={labId} study={study} editable={false} onApplied={() => {}} onRefitted={() => {}} />,
    );
    expect((await screen.findByRole('alert')).textContent).toMatch(/cannot be read just now/);
    expect(screen.queryByText('Drawing…')).toBeNull();
    expect(calls[1]?.url).toBe(`/api/labs/${labId}/decay-sets/set-1/decays/0/curves`);
  });
});
