import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  EnergyInput,
  EnergyRecord,
  EnergyUpdate,
  LifetimeInput,
  LifetimeRecord,
  LifetimeUpdate,
  PotentialInput,
  PotentialUpdate,
  RedoxPotentialRecord,
} from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import type { MeasurementSegment } from './delete-measurement';
import { libraryKeys } from './library-keys';

/** The bodies and answers of the three measurement endpoints, by the path segment that names them. */
export interface Measurements {
  potentials: { input: PotentialInput; update: PotentialUpdate; record: RedoxPotentialRecord };
  lifetimes: { input: LifetimeInput; update: LifetimeUpdate; record: LifetimeRecord };
  energies: { input: EnergyInput; update: EnergyUpdate; record: EnergyRecord };
}

/** A new record, or a correction of `id` sent with the version read (409 stale_version otherwise). */
export type MeasurementChange<S extends MeasurementSegment> =
  { id?: undefined; body: Measurements[S]['input'] } | { id: string; body: Measurements[S]['update'] };

/**
 * POST /api/labs/:labId/compounds/:compoundId/{potentials|lifetimes|energies}, or PATCH …/:id.
 * 400 names each bad field.
 */
export function saveMeasurement<S extends MeasurementSegment>(
  labId: string,
  compoundId: string,
  segment: S,
  change: MeasurementChange<S>,
) {
  const url = `/api/labs/${labId}/compounds/${compoundId}/${segment}`;
  return change.id === undefined
    ? apiClient.post<Measurements[S]['record']>(url, change.body)
    : apiClient.patch<Measurements[S]['record']>(`${url}/${change.id}`, change.body);
}

export function useSaveMeasurement<S extends MeasurementSegment>(labId: string, compoundId: string, segment: S) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: MeasurementChange<S>) => saveMeasurement(labId, compoundId, segment, change),
    // The compound, the list counts, excited-state potentials and every driving force may change.
    onSettled: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
