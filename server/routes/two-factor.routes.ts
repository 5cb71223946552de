import { Op } from 'sequelize';
import {
  labSignInRulesSchema,
  passwordConfirmationSchema,
  recoveryCodesSchema,
  twoFactorConfirmSchema,
  twoFactorSetupSchema,
} from '@shared/schemas/two-factor';
import { labParamsSchema } from '@shared/schemas/members';
import { defineRoute } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import { AppError } from '../lib/app-error';
import { Lab, User } from '../models';
import { recordLabAudit } from '../services/audit.service';
import {
  confirmTwoFactor,
  disableTwoFactor,
  renewRecoveryCodes,
  startTwoFactorSetup,
} from '../services/two-factor.service';

export const twoFactorRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/account/two-factor/setup',
    summary: 'Start turning on two-step sign-in: a new secret for the authenticator app',
    tags: ['account'],
    access: 'signed-in',
    responses: {
      200: { description: 'The secret, its otpauth URI and a QR code', schema: twoFactorSetupSchema },
      401: { description: 'Not signed in' },
      409: { description: 'Already on' },
    },
    handler: async ({ req, res }) => {
      const setup = await startTwoFactorSetup(signedInActor(req).userId);
      req.session.totpSetupSecret = setup.secret;
      res.json(setup);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/account/two-factor',
    summary: 'Turn on two-step sign-in with a first code from the app; answers the recovery codes, once',
    tags: ['account'],
    access: 'signed-in',
    request: { body: twoFactorConfirmSchema },
    responses: {
      201: { description: 'On; keep these recovery codes somewhere safe', schema: recoveryCodesSchema },
      400: { description: 'The code does not match' },
      401: { description: 'Not signed in' },
      409: { description: 'No set-up waiting, or already on' },
    },
    handler: async ({ req, res, body }) => {
      const { sequelize } = req.app.locals.services;
      const recoveryCodes = await confirmTwoFactor(
        sequelize,
        signedInActor(req),
        req.session.totpSetupSecret,
        body.code,
      );
      delete req.session.totpSetupSecret;
      req.session.twoFactorVerified = true;
      res.status(201).json({ recoveryCodes });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/account/two-factor/disable',
    summary: 'Turn two-step sign-in off (password needed; refused while a lab requires it of you)',
    tags: ['account'],
    access: 'signed-in',
    rateLimit: 'signIn',
    request: { body: passwordConfirmationSchema },
    responses: {
      204: { description: 'Off' },
      400: { description: 'Wrong password' },
      401: { description: 'Not signed in' },
      409: { description: 'A lab requires it of you' },
    },
    handler: async ({ req, res, body }) => {
      await disableTwoFactor(signedInActor(req), body.password);
      req.session.twoFactorVerified = false;
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/account/two-factor/recovery-codes',
    summary: 'A new set of recovery codes (password needed); the old ones stop working',
    tags: ['account'],
    access: 'signed-in',
    rateLimit: 'signIn',
    request: { body: passwordConfirmationSchema },
    responses: {
      201: { description: 'The new codes, shown once', schema: recoveryCodesSchema },
      400: { description: 'Wrong password' },
      401: { description: 'Not signed in' },
      409: { description: 'Two-step sign-in is off' },
    },
    handler: async ({ req, res, body }) => {
      const recoveryCodes = await renewRecoveryCodes(
        req.app.locals.services.sequelize,
        signedInActor(req),
        body.password,
      );
      res.status(201).json({ recoveryCodes });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/api/labs/:labId/sign-in-rules',
    summary: "Require (or stop requiring) two-step sign-in of the lab's admins and reviewers",
    tags: ['members'],
    access: { lab: 'admin' },
    request: { params: labParamsSchema, body: labSignInRulesSchema },
    responses: {
      200: { description: 'The rules now', schema: labSignInRulesSchema },
      400: { description: 'Not a boolean' },
      401: { description: 'Not signed in' },
      403: { description: 'Not an admin of this lab' },
      404: { description: 'Not your lab' },
      409: { description: 'Turn on two-step sign-in for yourself first' },
    },
    handler: async ({ req, res, body }) => {
      const lab = labOf(req);
      const actor = signedInActor(req);
      if (
        body.requireTwoFactor &&
        !(await User.count({ where: { id: actor.userId, totpEnabledAt: { [Op.ne]: null } } }))
      ) {
        throw new AppError(
          'two_factor_off',
          'Turn on two-step sign-in for yourself first (Account), so the rule does not lock you out.',
          409,
        );
      }
      await Lab.update({ requireTwoFactor: body.requireTwoFactor }, { where: { id: lab.id } });
      await recordLabAudit({ lab, actor }, 'lab_sign_in_rules_changed', ['lab', lab.id], {
        requireTwoFactor: body.requireTwoFactor,
      });
      res.json({ requireTwoFactor: body.requireTwoFactor });
    },
  }),
];
