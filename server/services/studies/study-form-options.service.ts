import { SOLVENTS } from '@shared/engine';
import type { StudyFormOptions } from '@shared/schemas/studies';
import type { LabContext } from '../../domain/lab-context';
import { Compound, ExcitedStateLifetime, Membership, User } from '../../models';

/** What the study form and the list filters pick from: the lab's compounds, emitter lifetimes, solvents, people. */
export async function studyFormOptions(lab: LabContext): Promise<StudyFormOptions> {
  const [compounds, lifetimes, memberships] = await Promise.all([
    Compound.findAll({ where: { labId: lab.id }, attributes: ['id', 'name', 'roleHint'], order: [['name', 'ASC']] }),
    ExcitedStateLifetime.findAll({ where: { labId: lab.id }, order: [['createdAt', 'DESC']] }),
    Membership.findAll({
      where: { labId: lab.id },
      include: [{ model: User, as: 'user', attributes: ['id', 'name'] }],
    }),
  ]);
  return {
    compounds: compounds.map((compound) => ({ id: compound.id, name: compound.name, roleHint: compound.roleHint })),
    lifetimes: lifetimes.map((lifetime) => ({
      id: lifetime.id,
      compoundId: lifetime.compoundId,
      value: lifetime.value,
      uncertainty: lifetime.uncertainty ?? null,
      solvent: lifetime.solvent,
      atmosphere: lifetime.atmosphere,
      temperature: lifetime.temperature,
    })),
    solvents: Object.values(SOLVENTS).map((solvent) => ({
      id: solvent.id,
      name: solvent.name,
      viscosity: solvent.viscosity,
    })),
    members: memberships
      .flatMap((membership) => (membership.user ? [{ userId: membership.user.id, name: membership.user.name }] : []))
      .sort((a, b) => a.name.localeCompare(b.name)),
  };
}
