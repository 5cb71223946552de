import type { CompoundListQuery } from '@shared/schemas/library';
import type { DrivingForceQuery } from '@shared/schemas/driving-force';

export const libraryKeys = {
  all: ['library'] as const,
  lab: (labId: string) => [...libraryKeys.all, labId] as const,
  list: (labId: string, query: CompoundListQuery) => [...libraryKeys.lab(labId), 'list', query] as const,
  detail: (labId: string, compoundId: string) => [...libraryKeys.lab(labId), 'detail', compoundId] as const,
  settings: (labId: string) => [...libraryKeys.lab(labId), 'settings'] as const,
  drivingForce: (labId: string, query: DrivingForceQuery) =>
    [...libraryKeys.lab(labId), 'driving-force', query] as const,
  dependents: (labId: string, lifetimeId: string) => [...libraryKeys.lab(labId), 'dependents', lifetimeId] as const,
};
