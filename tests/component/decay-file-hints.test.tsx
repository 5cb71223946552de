import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DecaysPanel } from '@/features/decays/components/decays-panel';
import { LibraryDecays } from '@/features/decays/components/library-decays';
import { ACCEPTED_EXTENSIONS } from '../../server/services/studies/parse/read-upload';
import { answerFetch, renderWithClient } from './support/render';
import { labId, studyDetail } from './support/study-fixture';

/** The hint under a file field: the first description of its picker (FileField: hint, then the chosen name). */
function hintOf(label: string) {
  const picker = screen.getByLabelText(label);
  const hintId = picker.getAttribute('aria-describedby')!.split(' ')[0]!;
  return document.getElementById(hintId)!.textContent!;
}

/** The extensions a hint names, in its order: ".csv .txt …" at the end, in brackets. */
const extensionsIn = (hint: string) => hint.match(/\.[a-z]+/g) ?? [];

describe('decay file hints', () => {
  // The server's list (server/services/studies/parse/read-upload.ts) is what refuses a file with
  // 415, and the decay routes read through the same receiver: the hint names exactly that list.
  it('when a study takes decays, then the decay file hint names every file type the server reads', async () => {
    answerFetch({ items: [] });
    renderWithClient(
      <DecaysPanel labId={labId} study={studyDetail()} editable onApplied={() => {}} onRefitted={() => {}} />,
    );
    const hint = hintOf('Decay file');
    expect(hint).toMatch(/^Time in the first column, one counts column per decay/);
    expect(extensionsIn(hint)).toEqual(ACCEPTED_EXTENSIONS);
  });

  it('when a compound takes a decay, then its decay file hint names the same list', () => {
    answerFetch({ items: [] });
    renderWithClient(
      <LibraryDecays
        labId={labId}
        compoundId="c0ffee00-0000-4000-8000-000000000001"
        compoundName="HL-Ir-7"
        defaultSolvent="acetonitrile"
        canAdd
        mayEdit={() => false}
        onKept={() => {}}
        onRefitted={() => {}}
      />,
    );
    const hint = hintOf('Decay file of the emitter');
    expect(hint).toMatch(/column named IRF/);
    expect(extensionsIn(hint)).toEqual(ACCEPTED_EXTENSIONS);
  });
});
