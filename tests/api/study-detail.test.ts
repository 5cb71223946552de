import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { settingsOf, solventLabel } from '../../server/services/studies/study-serialize';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
type Client = Awaited<ReturnType<typeof apiClient>>;
let labId = '';
let researcher: Client;
let reviewer: Client;
let researcherCsrf = '';
const names = { researcher: '', reviewer: '' };

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'reviewer'] });
  labId = lab.id;
  researcher = await apiClient(testApp.app);
  researcherCsrf = (await researcher.signIn(users.researcher)).body.csrfToken;
  reviewer = await apiClient(testApp.app);
  await reviewer.signIn(users.reviewer);
  names.researcher = users.researcher.name;
  names.reviewer = users.reviewer.name;
});
afterAll(testApp.close);

const url = (studyId: string) => `/api/labs/${labId}/studies/${studyId}`;

describe('GET /api/labs/:labId/studies/:studyId', () => {
  it('when a study has points, a fit, an upload and a review, then the detail gives each record as stored, with who made it', async () => {
    const study = await createStudy(researcher, labId, crypto.randomBytes(3).toString('hex'));
    await researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    // A small two-column series (invented numbers).
    const csv = Buffer.from('quencher (mM),intensity\n0,1000\n1,800\n2,660\n3,570\n');
    await researcher.agent
      .post(`${url(study.id)}/uploads`)
      .set('x-csrf-token', researcherCsrf)
      .attach('file', csv, 'series.csv')
      .expect(201);
    await researcher.post(`${url(study.id)}/submit`, {}).expect(200);
    await reviewer.post(`${url(study.id)}/return`, { comment: 'Add a replicate blank' }).expect(200);

    const detail = (await researcher.get(url(study.id)).expect(200)).body;

    // The same records read through the models, the way the rest of the server reads them.
    const { Compound, Study, StudyFit, StudyPoint, StudyReview, StudyUpload } = await import('../../server/models');
    const stored = (await Study.findByPk(study.id))!;
    const points = await StudyPoint.findAll({ where: { studyId: study.id }, order: [['position', 'ASC']] });
    const fit = (await StudyFit.findByPk(stored.latestFitId!))!;
    const uploads = await StudyUpload.findAll({ where: { studyId: study.id }, attributes: { exclude: ['content'] } });
    const reviews = await StudyReview.findAll({ where: { studyId: study.id }, order: [['createdAt', 'ASC']] });

    // The study's own fields (read as plain rows) as the model gives them, names and times included.
    const emitter = (await Compound.findByPk(stored.emitterId))!;
    const quencher = (await Compound.findByPk(stored.quencherId))!;
    const { points: _p, latestFit: _f, uploads: _u, reviews: _r, ...own } = detail;
    expect(own).toEqual({
      ...settingsOf(stored),
      id: stored.id,
      emitter: { id: emitter.id, name: emitter.name },
      quencher: { id: quencher.id, name: quencher.name },
      solventLabel: solventLabel(stored),
      status: 'returned',
      revision: stored.revision,
      previousRevisionId: null,
      nextRevisionId: null,
      ownerId: stored.ownerId,
      ownerName: names.researcher,
      version: stored.version,
      createdAt: stored.createdAt.toISOString(),
      updatedAt: stored.updatedAt.toISOString(),
      fitProblem: stored.fitProblem,
      tau0Source: null,
    });
    expect(
      detail.points.map((point: Record<string, unknown>) => [point.id, point.position, point.concentration]),
    ).toEqual(points.map((point) => [point.id, point.position, point.concentration]));
    expect(detail.points.map((point: { intensity: number }) => point.intensity)).toEqual(
      points.map((point) => point.intensity),
    );
    expect(detail.latestFit).toEqual({
      id: fit.id,
      model: fit.model,
      trigger: fit.trigger,
      kSv: fit.kSv,
      kq: fit.kq,
      result: fit.result,
      pointsUsed: fit.pointsUsed,
      engineVersion: fit.engineVersion,
      weighting: fit.weighting,
      createdBy: names.researcher,
      createdAt: fit.createdAt.toISOString(),
    });
    // toMatchObject: how the file was read comes along too (its own tests check that part).
    expect(detail.uploads).toMatchObject(
      uploads.map((upload) => ({
        id: upload.id,
        fileName: 'series.csv',
        mediaType: upload.mediaType,
        size: csv.length,
        sha256: crypto.createHash('sha256').update(csv).digest('hex'),
        parseStatus: upload.parseStatus,
        problem: typeof upload.parseReport.problem === 'string' ? upload.parseReport.problem : null,
        uploadedBy: names.researcher,
        createdAt: upload.createdAt.toISOString(),
      })),
    );
    expect(detail.reviews).toEqual(
      reviews.map((review) => ({
        id: review.id,
        action: review.action,
        comment: review.comment,
        author: review.authorId === null ? null : expect.any(String),
        createdAt: review.createdAt.toISOString(),
      })),
    );
    expect(detail.reviews.at(-1)).toMatchObject({ comment: 'Add a replicate blank', author: names.reviewer });
    expect(detail.nextRevisionId).toBeNull();
  });

  it('when a study with a fit is opened, then the fit goes out as PostgreSQL prints the stored record, never parsed and written again by the server', async () => {
    const study = await createStudy(researcher, labId, crypto.randomBytes(3).toString('hex'));
    await researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    const answer = await researcher.get(url(study.id)).expect(200);
    const [stored] = await testApp.sequelize.query<{ id: string; result: string; points_used: string }>(
      `SELECT f.id, f.result::text AS result, f.points_used::text AS points_used
         FROM study_fits f JOIN studies s ON s.latest_fit_id = f.id WHERE s.id = $1`,
      { bind: [study.id], type: QueryTypes.SELECT },
    );
    // The stored jsonb's own text (PostgreSQL's spacing and number printing), as it is.
    expect(answer.text).toContain(`"result" : ${stored!.result}`);
    expect(answer.text).toContain(`"pointsUsed" : ${stored!.points_used}`);
    expect(answer.headers['content-type']).toBe('application/json; charset=utf-8');
    // And the same values as the record read through the model.
    const { StudyFit } = await import('../../server/models');
    const fit = (await StudyFit.findByPk(stored!.id))!;
    expect(answer.body.latestFit).toMatchObject({ id: fit.id, result: fit.result, pointsUsed: fit.pointsUsed });
    expect(answer.body.latestFit.createdAt).toBe(fit.createdAt.toISOString());
    // The detail builds the fit's shape in SQL, the fits list through toFit (study-serialize.ts):
    // the two must give the very same object, every field, so neither drifts from the other.
    const fits = await researcher.get(`${url(study.id)}/fits`).expect(200);
    expect(answer.body.latestFit).toEqual(fits.body.items[0]);
  });

  it('when the latest fit is an older record whose plot names no axes, then the detail draws it as the screen did then', async () => {
    const study = await createStudy(researcher, labId, crypto.randomBytes(3).toString('hex'));
    await researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    // A record made before the plot series named their axes and carried the left-out points.
    await testApp.sequelize.query(
      `UPDATE study_fits f SET result = (f.result #- '{plot,xAxis}') #- '{plot,excluded}'
         FROM studies s WHERE s.id = $1 AND f.id = s.latest_fit_id`,
      { bind: [study.id] },
    );
    const detail = (await researcher.get(url(study.id)).expect(200)).body;
    expect(detail.latestFit.result.plot.xAxis).toMatchObject({ label: '[Q] (mM)', unit: 'mM' });
    expect(detail.latestFit.result.plot.excluded).toEqual([]);
    expect(detail.latestFit.result.plot.points.map((p: { position: number }) => p.position)).toEqual(
      detail.latestFit.pointsUsed.map((p: { position: number }) => p.position),
    );
  });

  it("when the study is another lab's, then 404 and nothing of it comes back", async () => {
    const other = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const outsider = await apiClient(testApp.app);
    await outsider.signIn(other.users.researcher);
    const study = await createStudy(researcher, labId, crypto.randomBytes(3).toString('hex'));
    const response = await outsider.get(`/api/labs/${other.lab.id}/studies/${study.id}`);
    expect(response.status).toBe(404);
    expect(response.body.points).toBeUndefined();
  });
});
