import { studyParamsSchema } from '@shared/schemas/studies';
import { returnStudySchema, reviewCommentSchema, studyDetailSchema } from '@shared/schemas/study-detail';
import { defineRoute, type RouteContext } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import { addComment, reviewStep, startRevision } from '../services/studies/study-review.service';

const stepResponses = {
  200: { description: 'The study in its new status', schema: studyDetailSchema },
  403: { description: 'Role or ownership does not allow this step' },
  404: { description: 'No such study in this lab' },
  409: { description: 'The study is not in a status that allows this step' },
};

/** Moves the study one review step on (mailing whom the step concerns) and answers with it. */
const takeStep =
  (step: 'submit' | 'approve' | 'return') =>
  async ({ req, res, params, body }: RouteContext<{ studyId: string }, unknown, { comment: string }>) => {
    const { sequelize, jobs, publicUrl } = req.app.locals.services;
    const context = { actor: signedInActor(req), jobs, publicUrl };
    res.json(await reviewStep(sequelize, labOf(req), params.studyId, step, body.comment, context));
  };

export const studyReviewRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/submit',
    summary: 'Submit for review (owner); reviewers are mailed',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema, body: reviewCommentSchema },
    responses: stepResponses,
    handler: takeStep('submit'),
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/approve',
    summary: 'Approve a submitted study (reviewer); it is locked and the owner is mailed',
    tags: ['studies'],
    access: { lab: 'reviewer' },
    request: { params: studyParamsSchema, body: reviewCommentSchema },
    responses: stepResponses,
    handler: takeStep('approve'),
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/return',
    summary: 'Return a submitted study with a comment (reviewer); the owner is mailed',
    tags: ['studies'],
    access: { lab: 'reviewer' },
    request: { params: studyParamsSchema, body: returnStudySchema },
    responses: { ...stepResponses, 400: { description: 'A comment is required' } },
    handler: takeStep('return'),
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/comments',
    summary: "Add a comment to the study's thread",
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema, body: returnStudySchema },
    responses: { ...stepResponses, 400: { description: 'Empty comment' } },
    handler: async ({ req, res, params, body }) => {
      res.json(await addComment(labOf(req), params.studyId, body.comment, signedInActor(req)));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/revisions',
    summary: 'Start a new draft revision of an approved study (owner or reviewer); the approved one is kept',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: { ...stepResponses, 201: { description: 'The new revision', schema: studyDetailSchema } },
    handler: async ({ req, res, params }) => {
      res
        .status(201)
        .json(await startRevision(req.app.locals.services.sequelize, labOf(req), params.studyId, signedInActor(req)));
    },
  }),
];
