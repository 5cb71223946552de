import { Op, type Order, type WhereOptions } from 'sequelize';
import type { ListStudiesQuery, StudyList } from '@shared/schemas/studies';
import type { LabContext } from '../../domain/lab-context';
import { Compound, Study, User } from '../../models';
import { toSummary, type SummaryRow } from './study-serialize';

const summaryColumns = [
  'id',
  'title',
  'emitterId',
  'quencherId',
  'solventId',
  'customSolventName',
  'status',
  'revision',
  'ownerId',
  'kSv',
  'kq',
  'flagged',
  'updatedAt',
] as const satisfies readonly (keyof Study)[];

const escapeLike = (text: string) => text.replace(/[\\%_]/g, '\\$&');

/**
 * One page of the lab's current study revisions with a total count. Every filter maps to an
 * index of migration 0005 (lab_id first, current revisions only), the kq and K_SV sorts to those
 * of migration 0008 (same NULLS LAST and id tie-breaker as the ORDER BY below); text search uses
 * the trigram index on title || ' ' || notes.
 */
export async function listStudies(lab: LabContext, query: ListStudiesQuery): Promise<StudyList> {
  const where: WhereOptions<Study> & Record<string | symbol, unknown> = { labId: lab.id, isCurrent: true };
  if (query.emitterId) where.emitterId = query.emitterId;
  if (query.quencherId) where.quencherId = query.quencherId;
  if (query.solventId) where.solventId = query.solventId;
  if (query.status) where.status = query.status;
  if (query.ownerId) where.ownerId = query.ownerId;
  if (query.flagged === 'true') where.flagged = true;
  if (query.q) {
    const sequelize = Study.sequelize!;
    where[Op.and] = sequelize.where(sequelize.literal('("Study"."title" || \' \' || "Study"."notes")'), {
      [Op.iLike]: `%${escapeLike(query.q)}%`,
    });
  }
  const direction = query.direction === 'asc' ? 'ASC' : 'DESC';
  const nulls = direction === 'ASC' ? 'ASC NULLS LAST' : 'DESC NULLS LAST';
  const order: Order =
    query.sort === 'kq'
      ? [
          ['kq', nulls],
          ['id', 'ASC'],
        ]
      : query.sort === 'k_sv'
        ? [
            ['kSv', nulls],
            ['id', 'ASC'],
          ]
        : [
            ['updatedAt', direction],
            ['id', 'ASC'],
          ];
  // The joins are to-one and never change the count, so it counts studies alone (no DISTINCT over
  // joined rows); the page comes back as plain rows, without building a model instance per row.
  const [rows, count] = await Promise.all([
    Study.findAll({
      where,
      attributes: [...summaryColumns],
      include: [
        { model: Compound, as: 'emitter', attributes: ['id', 'name'] },
        { model: Compound, as: 'quencher', attributes: ['id', 'name'] },
        { model: User, as: 'owner', attributes: ['id', 'name'] },
      ],
      order,
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
      raw: true,
      nest: true,
    }) as unknown as Promise<SummaryRow[]>,
    Study.count({ where }),
  ]);
  return { items: rows.map(toSummary), total: count, page: query.page, pageSize: query.pageSize };
}
