import type { Transaction } from 'sequelize';
import type { Actor } from '../domain/actor';
import * as models from '../models';

/*
 * The demo scenario happened over the weeks before it was loaded: studies were started,
 * submitted and reviewed on different days. The clock gives the records made while seeding the
 * time of the step they belong to, and keeps the lab's own events (created, submitted, approved
 * ...) to append them to the audit log in the order they happened, so "Recent activity" and each
 * study's history read like a real lab's.
 */

const DAY = 24 * 3600 * 1000;
const HOUR = 3600 * 1000;

interface PendingEvent {
  at: Date;
  actor: Actor;
  action: string;
  labId: string;
  targetType: string;
  targetId: string;
  details: Record<string, unknown>;
}

export interface DemoClock {
  /** Moves the clock to `daysAgo` days before loading, at `hour` o'clock of that day (local to the server). */
  set(daysAgo: number, hour: number): void;
  now(): Date;
  /** Queues an audit event at the clock's time (appended in time order by `flush`). */
  record(
    actor: Actor,
    action: string,
    labId: string,
    targetId: string,
    details: Record<string, unknown>,
    targetType?: string,
  ): void;
  /** Appends the queued events, oldest first. */
  flush(): Promise<void>;
  /** Stops stamping records (call it whatever happened). */
  stop(): void;
}

type Stampable = { createdAt?: Date; updatedAt?: Date; isNewRecord?: boolean };
/** The part of a model class the clock needs: adding and removing a named hook. */
interface Hookable {
  addHook(kind: 'beforeCreate' | 'beforeUpdate', name: string, hook: (instance: unknown, options: never) => void): void;
  removeHook(kind: 'beforeCreate' | 'beforeUpdate', name: string): void;
}
const timestamped: Hookable[] = [
  models.AuditEvent,
  models.Compound,
  models.DecayFile,
  models.DecaySet,
  models.ExcitedStateEnergy,
  models.ExcitedStateLifetime,
  models.RedoxPotential,
  models.Study,
  models.StudyFit,
  models.StudyReview,
] as unknown as Hookable[];

/** A clock for the seeding transaction: records made in it take the clock's time. */
export function startDemoClock(transaction: Transaction, loadedAt = new Date()): DemoClock {
  let current = loadedAt;
  const pending: PendingEvent[] = [];
  const stamp = (instance: unknown, options: { transaction?: Transaction | null }): void => {
    if (options.transaction !== transaction) return;
    const record = instance as Stampable;
    if (record.isNewRecord) record.createdAt = current;
    if ('updatedAt' in record) record.updatedAt = current;
  };
  for (const model of timestamped) {
    model.addHook('beforeCreate', 'demoClock', stamp);
    model.addHook('beforeUpdate', 'demoClock', stamp);
  }
  const stop = () => {
    for (const model of timestamped) {
      model.removeHook('beforeCreate', 'demoClock');
      model.removeHook('beforeUpdate', 'demoClock');
    }
  };
  return {
    set(daysAgo, hour) {
      const day = new Date(loadedAt.getTime() - daysAgo * DAY);
      day.setHours(0, 0, 0, 0);
      const at = new Date(day.getTime() + hour * HOUR);
      // Today's steps never lie in the future.
      current = at > loadedAt ? new Date(loadedAt.getTime() - HOUR) : at;
    },
    now: () => current,
    record(actor, action, labId, targetId, details, targetType = 'study') {
      pending.push({ at: current, actor, action, labId, targetType, targetId, details });
    },
    async flush() {
      pending.sort((a, b) => a.at.getTime() - b.at.getTime());
      for (const event of pending) {
        current = event.at;
        await models.AuditEvent.create(
          {
            labId: event.labId,
            actorId: event.actor.userId,
            action: event.action,
            targetType: event.targetType,
            targetId: event.targetId,
            details: event.details,
            ipAddress: event.actor.ip,
          },
          { transaction },
        );
      }
      pending.length = 0;
    },
    stop,
  };
}
