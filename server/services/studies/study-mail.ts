import { Op } from 'sequelize';
import type { Transaction } from 'sequelize';
import type { JobQueue } from '../../jobs/job-queue';
import { mailJobs } from '../../mail/mail-jobs';
import type { OutgoingMessage } from '../../mail/mailer';
import { Membership, User, type Study } from '../../models';

const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (char) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[char]!);

const SUBJECTS = {
  submit: (title: string) => `Study ready for review: ${title}`,
  approve: (title: string) => `Study approved: ${title}`,
  return: (title: string) => `Study returned with comments: ${title}`,
} as const;

const LEADS = {
  submit: (actor: string) => `${actor} has submitted a quenching study for review.`,
  approve: (actor: string) =>
    `${actor} has approved your quenching study. It is now locked; a change starts a new revision.`,
  return: (actor: string) => `${actor} has returned your quenching study with comments.`,
} as const;

/**
 * Review e-mails: a submission goes to the lab's reviewers and admins, a decision to the
 * owner; the actor is never mailed about their own step. Queued in the review's transaction, so
 * the step and its e-mails are saved together, and a mail relay that is down only delays them.
 */
export async function notifyReview(
  context: { jobs: JobQueue; publicUrl: string; transaction: Transaction },
  study: Study,
  action: 'submit' | 'approve' | 'return',
  actorId: string,
  comment: string,
): Promise<void> {
  const actor = await User.findByPk(actorId, { attributes: ['name'] });
  let recipients: User[];
  if (action === 'submit') {
    const memberships = await Membership.findAll({
      where: { labId: study.labId, role: { [Op.in]: ['reviewer', 'admin'] }, userId: { [Op.ne]: actorId } },
      include: [{ model: User, as: 'user', attributes: ['email', 'name'] }],
    });
    recipients = memberships.flatMap((membership) => (membership.user ? [membership.user] : []));
  } else {
    const owner =
      study.ownerId && study.ownerId !== actorId
        ? await User.findByPk(study.ownerId, { attributes: ['email', 'name'] })
        : null;
    recipients = owner ? [owner] : [];
  }
  const link = `${context.publicUrl}/labs/${study.labId}/studies/${study.id}`;
  const lead = LEADS[action](actor?.name ?? 'A lab member');
  const paragraphs = [
    lead,
    `Study: ${study.title} (revision ${study.revision}).`,
    ...(comment ? [`Comment: ${comment}`] : []),
  ];
  for (const recipient of recipients) {
    await context.jobs.send<OutgoingMessage>(
      mailJobs.message,
      {
        to: recipient.email,
        kind: 'review',
        labId: study.labId,
        subject: SUBJECTS[action](study.title),
        text: `${paragraphs.join('\n\n')}\n\nOpen the study:\n${link}\n`,
        html: `<!doctype html><html><body style="font-family: Lato, Arial, sans-serif; color: #1c1938;">${paragraphs
          .map((text) => `<p>${escapeHtml(text)}</p>`)
          .join('\n')}<p><a href="${escapeHtml(link)}">Open the study</a></p></body></html>`,
      },
      { transaction: context.transaction },
    );
  }
}
