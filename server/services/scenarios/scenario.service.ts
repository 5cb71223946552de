import type { Sequelize, Transaction } from 'sequelize';
import type { z } from 'zod';
import { roleAtLeast } from '@shared/schemas/roles';
import type { Scenario, ScenarioList, scenarioInputSchema } from '@shared/schemas/scenarios';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Compound, ReactionScenario, ScenarioComponent, Study, User } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';
import { evaluateScenario } from './evaluate-scenario';

type ScenarioInput = z.infer<typeof scenarioInputSchema>;

const notFound = () => new AppError('not_found', 'No reaction scenario with this id in this lab.', 404);

async function loadScenario(labId: string, scenarioId: string, transaction?: Transaction) {
  const scenario = await ReactionScenario.findOne({
    where: { id: scenarioId, labId },
    include: [
      { model: Compound, as: 'emitter' },
      { model: ScenarioComponent, as: 'components', include: [{ model: Compound, as: 'compound' }] },
    ],
    order: [[{ model: ScenarioComponent, as: 'components' }, 'position', 'ASC']],
    transaction,
  });
  if (!scenario) throw notFound();
  return scenario;
}

/** Checks that every id in the input belongs to this lab and fits together; names each bad field. */
async function checkReferences(labId: string, input: ScenarioInput, transaction: Transaction): Promise<void> {
  const issues: { path: string; message: string }[] = [];
  const emitter = await Compound.findOne({ where: { id: input.emitterId, labId }, transaction });
  if (!emitter) issues.push({ path: 'body.emitterId', message: 'is not a compound of this lab' });
  for (const [index, component] of input.components.entries()) {
    if (component.compoundId && !(await Compound.count({ where: { id: component.compoundId, labId }, transaction }))) {
      issues.push({ path: `body.components.${index}.compoundId`, message: 'is not a compound of this lab' });
    }
    if (component.studyId) {
      const study = await Study.findOne({ where: { id: component.studyId, labId }, transaction });
      if (!study) {
        issues.push({ path: `body.components.${index}.studyId`, message: 'is not a study of this lab' });
      } else if (study.emitterId !== input.emitterId || study.quencherId !== component.compoundId) {
        issues.push({ path: `body.components.${index}.studyId`, message: 'studies a different emitter or quencher' });
      } else if (study.kq === null) {
        issues.push({ path: `body.components.${index}.studyId`, message: 'has no fitted kq yet' });
      }
    }
  }
  if (issues.length) {
    throw new AppError(
      'validation_failed',
      `The scenario has problems: ${issues.map((i) => `${i.path} ${i.message}`).join('; ')}.`,
      400,
      issues,
    );
  }
}

async function writeComponents(scenarioId: string, input: ScenarioInput, transaction: Transaction) {
  await ScenarioComponent.destroy({ where: { scenarioId }, transaction });
  await ScenarioComponent.bulkCreate(
    input.components.map((component, position) => ({
      scenarioId,
      position,
      kind: component.kind,
      compoundId: component.compoundId ?? null,
      concentration: component.concentration,
      studyId: component.studyId ?? null,
      manualKq: component.manualKq ?? null,
      manualKqSource: component.manualKqSource ?? null,
    })),
    { transaction },
  );
}

async function creatorName(scenario: ReactionScenario) {
  return scenario.createdById ? ((await User.findByPk(scenario.createdById))?.name ?? null) : null;
}

export async function getScenario(lab: LabContext, scenarioId: string): Promise<Scenario> {
  const scenario = await loadScenario(lab.id, scenarioId);
  return evaluateScenario(scenario, await creatorName(scenario));
}

export async function listScenarios(lab: LabContext, page: number, pageSize: number): Promise<ScenarioList> {
  const { rows, count } = await ReactionScenario.findAndCountAll({
    where: { labId: lab.id },
    include: [
      { model: Compound, as: 'emitter' },
      { model: ScenarioComponent, as: 'components', attributes: ['id'] },
    ],
    order: [['updatedAt', 'DESC']],
    limit: pageSize,
    offset: (page - 1) * pageSize,
    distinct: true,
  });
  return {
    total: count,
    items: rows.map((scenario) => ({
      id: scenario.id,
      name: scenario.name,
      emitterName: scenario.emitter?.name ?? '',
      solvent: scenario.solvent,
      componentCount: scenario.components?.length ?? 0,
      updatedAt: scenario.updatedAt.toISOString(),
    })),
  };
}

export async function createScenario(sequelize: Sequelize, lab: LabContext, actor: Actor, input: ScenarioInput) {
  const id = await sequelize.transaction(async (transaction) => {
    await checkReferences(lab.id, input, transaction);
    const { name, emitterId, solvent, tau0, tau0Source, notes } = input;
    const scenario = await ReactionScenario.create(
      { labId: lab.id, name, emitterId, solvent, tau0, tau0Source, notes, createdById: actor.userId },
      { transaction },
    );
    await writeComponents(scenario.id, input, transaction);
    await recordLabAudit({ lab, actor, transaction }, 'scenario_created', ['scenario', scenario.id]);
    return scenario.id;
  });
  return getScenario(lab, id);
}

/** Researchers change their own scenarios; reviewers and admins any. */
function assertMayChange(lab: LabContext, actor: Actor, scenario: ReactionScenario) {
  if (scenario.createdById !== actor.userId && !roleAtLeast(lab.role, 'reviewer')) {
    throw new AppError(
      'forbidden',
      'Only the person who made this scenario, a reviewer or an admin can change it.',
      403,
    );
  }
}

export async function updateScenario(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  scenarioId: string,
  input: ScenarioInput,
) {
  await sequelize.transaction(async (transaction) => {
    const scenario = await loadScenario(lab.id, scenarioId, transaction);
    assertMayChange(lab, actor, scenario);
    if (input.version !== undefined && input.version !== scenario.version) {
      throw new AppError(
        'stale_version',
        'Someone changed this scenario after you opened it. Reload it and make your change again.',
        409,
      );
    }
    await checkReferences(lab.id, input, transaction);
    const { name, emitterId, solvent, tau0, tau0Source, notes } = input;
    scenario.set({ name, emitterId, solvent, tau0, tau0Source, notes });
    scenario.changed('updatedAt', true);
    await scenario.save({ transaction });
    await writeComponents(scenario.id, input, transaction);
    await recordLabAudit({ lab, actor, transaction }, 'scenario_updated', ['scenario', scenario.id]);
  });
  return getScenario(lab, scenarioId);
}

export async function deleteScenario(sequelize: Sequelize, lab: LabContext, actor: Actor, scenarioId: string) {
  await sequelize.transaction(async (transaction) => {
    const scenario = await loadScenario(lab.id, scenarioId, transaction);
    assertMayChange(lab, actor, scenario);
    await scenario.destroy({ transaction });
    await recordLabAudit({ lab, actor, transaction }, 'scenario_deleted', ['scenario', scenarioId], {
      name: scenario.name,
    });
  });
}
