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

const auditRow = (actor: Actor, entry: AuditEntry) => ({
  labId: entry.labId ?? null,
  actorId: actor.userId,
  action: entry.action,
  targetType: entry.targetType ?? null,
  targetId: entry.targetId ?? null,
  details: entry.details ?? {},
  ipAddress: actor.ip,
});

/**
 * An event built and not yet saved, for a change that writes it in the same statement as its
 * other rows (OneStatement, server/db/one-statement.ts).
 */
export const unsavedAuditEvent = (actor: Actor, entry: AuditEntry): AuditEvent =>
  AuditEvent.build(auditRow(actor, entry));

/** Appends one event to the audit log: who, what, when, from which address. */
export async function recordAudit(actor: Actor, entry: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(auditRow(actor, entry), { transaction });
}

/** What an event is about: the kind of record and its id. */
export type AuditTarget = readonly [type: string, id: string];

/** The change an event belongs to: its lab, who made it, and the transaction that carries it. */
export interface LabChange {
  lab: { id: string };
  actor: Actor;
  transaction?: Transaction;
}

/**
 * recordAudit for the usual event, one record of a lab changed:
 * `recordLabAudit({ lab, actor, transaction }, 'compound_changed', ['compound', compound.id], diff)`.
 */
export function recordLabAudit(
  { lab, actor, transaction }: LabChange,
  action: string,
  [targetType, targetId]: AuditTarget,
  details?: Record<string, unknown>,
): Promise<void> {
  return recordAudit(actor, { action, labId: lab.id, targetType, targetId, details }, transaction);
}

/** Appends several events of one change in one statement, in their order. */
export async function recordAudits(actor: Actor, entries: AuditEntry[], transaction?: Transaction): Promise<void> {
  if (entries.length === 1) return recordAudit(actor, entries[0]!, transaction);
  if (entries.length > 0)
    await AuditEvent.bulkCreate(
      entries.map((entry) => auditRow(actor, entry)),
      { transaction },
    );
}
