import type { Request } from 'express';
import { AppError } from '../lib/app-error';
import type { LabContext } from '../domain/lab-context';
import type { Actor, SignedInActor } from '../domain/actor';

export const actorOf = (req: Request): Actor => ({ userId: req.user?.id ?? null, ip: req.ip ?? null });

/** The signed-in actor; routes with access 'signed-in' or a lab role always have one. */
export function signedInActor(req: Request): SignedInActor {
  if (!req.user) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
  return { userId: req.user.id, ip: req.ip ?? null };
}

/** The lab resolved by requireLabRole for routes under /api/labs/:labId. */
export function labOf(req: Request): LabContext {
  if (!req.lab) throw new AppError('not_found', 'No such lab, or you are not a member of it.', 404);
  return req.lab;
}
