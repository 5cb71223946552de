import type { Transaction } from 'sequelize';
import { AuditEvent } from '../models';
import type { Actor } from '../domain/actor';

export interface AuditEntry {
  action: string;
  labId?: string | null;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
}

/** Appends one event to the audit log: who, what, when, from which address. */
export async function recordAudit(actor: Actor, entry: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      labId: entry.labId ?? null,
      actorId: actor.userId,
      action: entry.action,
      targetType: entry.targetType ?? null,
      targetId: entry.targetId ?? null,
      details: entry.details ?? {},
      ipAddress: actor.ip,
    },
    { transaction },
  );
}
