import { z } from 'zod';
import { roleSchema } from './roles';

const email = z.string().trim().toLowerCase().email('must be an e-mail address').max(254);
/**
 * A new password: at least 12 characters (above NIST SP 800-63B's minimum of 8; OWASP's ASVS asks
 * for 12), at most 200, every character counted. The server also refuses common and easily
 * guessed passwords (server/auth/password-policy.ts).
 */
export const passwordMinLength = 12;
export const passwordSchema = z
  .string()
  .min(passwordMinLength, `must be at least ${passwordMinLength} characters`)
  .max(200, 'must be at most 200 characters');
const personName = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
const token = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'is not a valid link token');

export const signInSchema = z
  .object({ email, password: z.string().min(1, 'is required').max(200) })
  .meta({ id: 'SignIn' });

export const labMembershipSchema = z
  .object({
    labId: z.string().uuid(),
    labName: z.string(),
    isDemo: z.boolean(),
    role: roleSchema,
    requireTwoFactor: z.boolean().describe('The lab requires two-step sign-in of its admins and reviewers'),
  })
  .meta({ id: 'LabMembership' });

export const sessionUserSchema = z
  .object({
    id: z.string().uuid(),
    email: z.string(),
    name: z.string(),
    labs: z.array(labMembershipSchema),
  })
  .meta({ id: 'SessionUser' });

export const sessionSchema = z
  .object({
    user: sessionUserSchema,
    csrfToken: z.string().describe('Send in the x-csrf-token header of every state-changing request'),
    mailCatcher: z.boolean().describe('True when outgoing mail is caught locally (each person reads their own)'),
    twoFactor: z
      .object({
        enabled: z.boolean().describe('Two-step sign-in is on for this person'),
        verified: z.boolean().describe('This session passed the second step (or set it up)'),
        recoveryCodesLeft: z.number().int(),
      })
      .describe('Two-step sign-in of the signed-in person'),
  })
  .meta({ id: 'Session' });

export const csrfTokenSchema = z.object({ csrfToken: z.string() }).meta({ id: 'CsrfToken' });

export const requestPasswordResetSchema = z.object({ email }).meta({ id: 'PasswordResetRequest' });
export const completePasswordResetSchema = z
  .object({ token, password: passwordSchema })
  .meta({ id: 'PasswordResetCompletion' });
export const changePasswordSchema = z
  .object({ currentPassword: z.string().min(1, 'is required').max(200), newPassword: passwordSchema })
  .meta({ id: 'PasswordChange' });
export const updateProfileSchema = z.object({ name: personName }).meta({ id: 'ProfileUpdate' });

export const invitationPreviewSchema = z
  .object({
    labName: z.string(),
    role: roleSchema,
    email: z.string(),
    invitedBy: z.string(),
    expiresAt: z.string(),
    accountExists: z.boolean().describe('True when the invited address already has a Halflight account'),
  })
  .meta({ id: 'InvitationPreview' });

/** A new person sends a name and chooses a password under the rules above. */
export const joinWithNewAccountSchema = z
  .object({ name: personName, password: passwordSchema })
  .meta({ id: 'InvitationAcceptanceNewAccount' });
/** A person who has an account sends only its password (whatever length it was set with). */
export const joinWithAccountSchema = z
  .strictObject({ password: z.string().min(1, 'is required').max(200) })
  .meta({ id: 'InvitationAcceptanceExistingAccount' });
export const acceptInvitationSchema = z
  .union([joinWithNewAccountSchema, joinWithAccountSchema])
  .meta({ id: 'InvitationAcceptance' });

export const messageSchema = z.object({ message: z.string() }).meta({ id: 'Message' });

export const accountSessionSchema = z
  .object({
    id: z.string().describe('A public handle of the session (not its cookie)'),
    current: z.boolean().describe('True for the session making this request'),
    signedInAt: z.string().nullable().describe('ISO 8601 time of the sign-in'),
    lastActiveAt: z.string().describe('ISO 8601 time of the latest request (to within five minutes)'),
    endsAt: z.string().describe('ISO 8601 time the session ends at the latest (absolute lifetime)'),
    userAgent: z.string().nullable(),
    ip: z.string().nullable(),
  })
  .meta({ id: 'AccountSession' });
export const accountSessionsSchema = z.object({ items: z.array(accountSessionSchema) }).meta({ id: 'AccountSessions' });
export const accountSessionParamsSchema = z.object({
  sessionId: z.string().regex(/^[0-9a-f]{32}$/, 'is not a session id'),
});

export type SignInInput = z.infer<typeof signInSchema>;
export type SessionUser = z.infer<typeof sessionUserSchema>;
export type Session = z.infer<typeof sessionSchema>;
export type LabMembership = z.infer<typeof labMembershipSchema>;
export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetSchema>;
export type CompletePasswordResetInput = z.infer<typeof completePasswordResetSchema>;
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type CsrfToken = z.infer<typeof csrfTokenSchema>;
export type Message = z.infer<typeof messageSchema>;
export type UpdateProfileInput = z.infer<typeof updateProfileSchema>;
export type AccountSession = z.infer<typeof accountSessionSchema>;
export type AccountSessions = z.infer<typeof accountSessionsSchema>;
