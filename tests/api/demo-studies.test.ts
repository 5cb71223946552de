import { afterAll, describe, expect, it } from 'vitest';
import { Lab, Study } from '../../server/models';
import { demoLabs, seedDemoData } from '../../server/seed/demo';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

describe('seedDemoStudies', () => {
  it('when the demo is loaded, then the demo lab has studies in every status, one above the diffusion limit, one curved, one with lifetimes', async () => {
    await seedDemoData(testApp.sequelize);
    const lab = await Lab.findOne({ where: { slug: demoLabs[0].slug } });
    const studies = await Study.findAll({ where: { labId: lab!.id } });
    expect(new Set(studies.map((study) => study.status))).toEqual(
      new Set(['draft', 'submitted', 'approved', 'returned']),
    );
    expect(new Set(studies.map((study) => study.quencherId)).size).toBeGreaterThanOrEqual(5);
    expect(studies.every((study) => study.title.startsWith('Demo') && study.latestFitId !== null)).toBe(true);
    const { StudyFit } = await import('../../server/models');
    const fits = await StudyFit.findAll({ where: { studyId: studies.map((study) => study.id) } });
    const codes = fits.flatMap((fit) => fit.result.flags.map((flag) => flag.code));
    expect(codes).toContain('KQ_ABOVE_DIFFUSION_LIMIT');
    expect(fits.some((fit) => fit.model === 'static-dynamic')).toBe(true);
    expect(fits.some((fit) => fit.result.lifetime !== null)).toBe(true);
  });
});
