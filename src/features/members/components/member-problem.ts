import { ApiError } from '@/lib/api-client';

/** Our explanation for refusals a person can act on; the server's own message otherwise. */
export function describeMemberProblem(error: unknown): string {
  if (error instanceof ApiError) {
    switch (error.code) {
      case 'last_admin':
        return 'A lab always needs at least one admin. Make someone else an admin first, then try again.';
      case 'already_member':
        return 'That address already belongs to a member of this lab.';
      case 'already_invited':
        return 'That address already has an invitation waiting. Withdraw it below to send a new one.';
      default:
        return error.message;
    }
  }
  return error instanceof Error ? error.message : 'An unexpected problem occurred.';
}
