/** Who did something, and from which address: what the audit log records. */
export interface Actor {
  userId: string | null;
  ip: string | null;
}

/** An actor known to be signed in (routes with access 'signed-in' or a lab role). */
export type SignedInActor = Actor & { userId: string };
