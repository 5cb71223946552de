import type { StudyDetail } from '@shared/schemas/study-detail';
import { pointAt, type StudyPoint } from '@shared/schemas/study-points';

// An invented study for component tests (demo-style numbers, not measurements).
export const labId = '0b7e6d4e-1c2a-4f5e-9d3b-2a1c0e9f8d7a';

export function point(position: number, concentration: number, intensity: number | null): StudyPoint {
  return {
    id: `00000000-0000-4000-8000-${String(position).padStart(12, '0')}`,
    position,
    ...pointAt(concentration),
    intensity,
    uploadId: null,
    lifetimeUncertainty: null,
    lifetimeSource: null,
    corrected: null,
  };
}

export function studyDetail(changes: Partial<StudyDetail> = {}): StudyDetail {
  return {
    id: '7c1d2e3f-4a5b-4c6d-8e7f-9a0b1c2d3e4f',
    title: 'Invented emitter with invented amine',
    solventId: 'acetonitrile',
    customSolventName: null,
    customViscosity: null,
    temperature: 298.15,
    excitationWavelength: 450,
    emissionWavelength: 610,
    windowStart: null,
    windowEnd: null,
    atmosphere: 'argon',
    degassingMethod: 'sparging',
    tau0: 1.1e-6,
    tau0Uncertainty: null,
    tau0LifetimeId: null,
    i0: null,
    dataKind: 'intensity',
    fitModel: 'linear-free',
    fitWeighting: 'unweighted',
    dilutionCorrection: false,
    initialVolume: null,
    stockConcentration: null,
    stockContainsEmitter: false,
    innerFilterCorrection: false,
    pinnedMechanism: null,
    notes: '',
    emitter: { id: '11111111-1111-4111-8111-111111111111', name: 'EM-1 (invented)' },
    quencher: { id: '22222222-2222-4222-8222-222222222222', name: 'QA-7 (invented)' },
    solventLabel: 'acetonitrile',
    status: 'draft',
    revision: 1,
    previousRevisionId: null,
    nextRevisionId: null,
    ownerId: null,
    ownerName: 'Ada Example',
    version: 3,
    createdAt: '2026-03-01T10:00:00.000Z',
    updatedAt: '2026-03-01T10:00:00.000Z',
    points: [point(0, 0, 1000), point(1, 0.001, 800)],
    latestFit: null,
    fitProblem: null,
    tau0Source: null,
    uploads: [],
    reviews: [],
    ...changes,
  };
}
