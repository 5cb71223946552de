import type { Transaction } from 'sequelize';
import { ENGINE_VERSION } from '@shared/engine';
import type { DecayFile, Lab, MechanismFile, Study, User } from '../models';
import { sha256Of } from '../services/studies/files/raw-file-store';
import type { DemoClock } from './demo-clock';

/** Where a record the demo keeps with a study goes: the lab, its owner (who "uploaded" it), the study. */
export interface DemoStudySeed {
  transaction: Transaction;
  lab: Lab;
  owner: User;
  study: Study;
  clock: DemoClock;
}

/** Where a record the demo keeps with no study goes (a library decay): the lab, who keeps it, the clock. */
export type DemoLabSeed = Omit<DemoStudySeed, 'study'>;

/** What the demo's audit events say of a kept file (as the services' own events do). */
export interface DemoKeptFile {
  id: string;
  fileName: string;
  size: number;
  sha256: string;
}

/**
 * Keeps one invented CSV of the demo in the database file store, in the given table (decay files
 * or mechanism files), uploaded by the seed's owner; answers what the audit event names.
 */
export async function keepDemoFile(
  table: typeof DecayFile | typeof MechanismFile,
  { transaction, lab, owner }: DemoLabSeed,
  fileName: string,
  bytes: Buffer,
): Promise<DemoKeptFile> {
  const sha256 = await sha256Of(bytes);
  const values = {
    labId: lab.id,
    fileName,
    mediaType: 'text/csv',
    size: bytes.length,
    sha256,
    storage: 'database' as const,
    storageKey: null,
    content: bytes,
    uploadedById: owner.id,
  };
  // The two tables share their columns (both extend StoredFile); create through the one at hand.
  const row = await (table as typeof MechanismFile).create(values, { transaction });
  return { id: row.id, fileName, size: bytes.length, sha256 };
}

/** The columns each record kept with a study shares: its lab and study, who kept it, with which engine. */
export const keptWithStudy = ({
  lab,
  owner,
  study,
}: DemoStudySeed): { labId: string; studyId: string; engineVersion: string; createdById: string } => ({
  labId: lab.id,
  studyId: study.id,
  engineVersion: ENGINE_VERSION,
  createdById: owner.id,
});
