import type { Transaction } from 'sequelize';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { ExcitedStateLifetime } from '../../models';

/** The three tau0 fields of a study as stored. */
export interface Tau0Fields {
  tau0: number | null;
  tau0Uncertainty: number | null;
  tau0LifetimeId: string | null;
}

// Doubles sent back as received compare equal; this only absorbs a decimal round trip.
const same = (a: number, b: number) => Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));

/**
 * The lifetime record behind a study's tau0: it must be in this lab (else 404, as for any id
 * that is not yours) and belong to the study's emitter (else 400 naming tau0LifetimeId).
 */
export async function lifetimeOfEmitter(
  labId: string,
  lifetimeId: string,
  emitterId: string,
  transaction?: Transaction,
): Promise<ExcitedStateLifetime> {
  const lifetime = await ExcitedStateLifetime.findOne({ where: { id: lifetimeId, labId }, transaction });
  if (!lifetime) {
    throw new AppError('not_found', 'No lifetime record with this id in this lab.', 404, [
      { path: 'body.tau0LifetimeId', message: 'no lifetime record with this id in this lab' },
    ]);
  }
  if (lifetime.compoundId !== emitterId) {
    throw new AppError('validation_failed', "The lifetime record must belong to the study's emitter.", 400, [
      { path: 'body.tau0LifetimeId', message: 'this lifetime record belongs to another compound than the emitter' },
    ]);
  }
  return lifetime;
}

/**
 * What a create or PATCH does to tau0, decided on the server:
 * - a lifetime record id (sent, or kept from before when nothing about tau0 is sent) gives the
 *   record's value and uncertainty; a tau0 or uncertainty sent beside it must equal the record's
 *   (else 400), so no other number can be stored under the record's name;
 * - a tau0 or uncertainty sent without a record id is typed: stored as entered, the link dropped;
 * - the record is checked against the lab and the (possibly new) emitter every time.
 */
export async function resolveTau0(
  lab: LabContext,
  sent: { tau0?: number | null; tau0Uncertainty?: number | null; tau0LifetimeId?: string | null },
  current: Tau0Fields | null,
  emitterId: string,
  transaction: Transaction | undefined,
): Promise<Tau0Fields> {
  const typed = sent.tau0 !== undefined || sent.tau0Uncertainty !== undefined;
  const lifetimeId =
    sent.tau0LifetimeId !== undefined ? sent.tau0LifetimeId : typed ? null : (current?.tau0LifetimeId ?? null);
  if (lifetimeId) {
    const record = await lifetimeOfEmitter(lab.id, lifetimeId, emitterId, transaction);
    const recordUncertainty = record.uncertainty ?? null;
    const mismatch = (field: 'tau0' | 'tau0Uncertainty', value: number | null | undefined, own: number | null) =>
      value !== undefined && value !== null && (own === null || !same(value, own))
        ? [{ path: `body.${field}`, message: `comes from the lifetime record (${own ?? 'none'} s); leave it out` }]
        : [];
    const issues = [
      ...mismatch('tau0', sent.tau0, record.value),
      ...mismatch('tau0Uncertainty', sent.tau0Uncertainty, recordUncertainty),
    ];
    if (issues.length > 0) {
      throw new AppError(
        'validation_failed',
        'tau0 is taken from the chosen lifetime record; send either the record id or a typed tau0.',
        400,
        issues,
      );
    }
    return { tau0: record.value, tau0Uncertainty: recordUncertainty, tau0LifetimeId: record.id };
  }
  const tau0 = sent.tau0 !== undefined ? sent.tau0 : (current?.tau0 ?? null);
  const tau0Uncertainty =
    sent.tau0Uncertainty !== undefined ? sent.tau0Uncertainty : (current?.tau0Uncertainty ?? null);
  return { tau0, tau0Uncertainty: tau0 === null ? null : tau0Uncertainty, tau0LifetimeId: null };
}
