import { caughtMailListSchema, paginationQuerySchema } from '@shared/schemas/members';
import { defineRoute } from '../http/define-route';
import { signedInActor } from '../http/request-context';
import { AppError } from '../lib/app-error';
import { listCaughtMail } from '../services/caught-mail.service';

export const caughtMailRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/caught-mail',
    summary:
      'Mail the local catcher took for me: messages to my address and invitations I sent (only when no SMTP relay is configured)',
    tags: ['account'],
    access: 'signed-in',
    request: { query: paginationQuerySchema },
    responses: {
      200: { description: 'Caught messages, newest first', schema: caughtMailListSchema },
      400: { description: 'Bad page or page size' },
      401: { description: 'Not signed in' },
      404: { description: 'No mail catcher in use: mail goes to a real relay' },
    },
    handler: async ({ req, res, query }) => {
      if (!req.app.locals.services.mailCatcher) {
        throw new AppError('not_found', 'Mail goes to a real relay here; there is no caught mail to read.', 404);
      }
      res.json(await listCaughtMail(signedInActor(req).userId, query.page, query.pageSize));
    },
  }),
];
