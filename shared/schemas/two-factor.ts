import { z } from 'zod';

/** A new authenticator secret: type it in, or scan the QR code (a PNG data URL of the otpauth URI). */
export const twoFactorSetupSchema = z
  .object({
    secret: z.string().describe('Base32 secret for the authenticator app'),
    otpauthUri: z.string().describe('otpauth://totp/... URI (RFC 6238 TOTP, 6 digits, 30 s)'),
    qrCode: z.string().describe('The URI as a QR code, a data:image/png;base64 URL'),
  })
  .meta({ id: 'TwoFactorSetup' });

const sixDigits = z
  .string()
  .trim()
  .regex(/^\d{6}$/, 'must be the 6 digits the app shows');

export const twoFactorConfirmSchema = z.object({ code: sixDigits }).meta({ id: 'TwoFactorConfirmation' });

export const recoveryCodesSchema = z
  .object({
    recoveryCodes: z.array(z.string()).describe('Shown once: each works once in place of a code'),
  })
  .meta({ id: 'RecoveryCodes' });

export const passwordConfirmationSchema = z
  .object({ password: z.string().min(1, 'is required').max(200) })
  .meta({ id: 'PasswordConfirmation' });

/** The second step of a sign-in: a code from the app, or one recovery code. */
export const secondStepSchema = z
  .object({
    code: sixDigits.optional(),
    recoveryCode: z
      .string()
      .trim()
      .regex(/^[0-9A-Za-z-]{16,24}$/, 'is not a recovery code')
      .optional(),
  })
  .refine((input) => Boolean(input.code) !== Boolean(input.recoveryCode), {
    message: 'give either the code from your app or one recovery code',
    path: ['code'],
  })
  .meta({ id: 'SecondStep' });

/** The answer to a right password when a second step is still needed. */
export const secondStepNeededSchema = z
  .object({
    twoFactorRequired: z.literal(true),
    csrfToken: z.string().describe('Send in x-csrf-token with the second step'),
  })
  .meta({ id: 'SecondStepNeeded' });

export const labSignInRulesSchema = z
  .object({ requireTwoFactor: z.boolean().describe('Admins and reviewers must sign in with a second step') })
  .meta({ id: 'LabSignInRules' });

export type TwoFactorSetup = z.infer<typeof twoFactorSetupSchema>;
export type RecoveryCodes = z.infer<typeof recoveryCodesSchema>;
export type SecondStepInput = z.infer<typeof secondStepSchema>;
export type SecondStepNeeded = z.infer<typeof secondStepNeededSchema>;
export type LabSignInRules = z.infer<typeof labSignInRulesSchema>;
