import { z } from 'zod';
import { roleSchema } from './roles';

export const labParamsSchema = z.object({ labId: z.string().uuid('must be a lab id') });
export const memberParamsSchema = labParamsSchema.extend({ memberId: z.string().uuid('must be a member id') });
export const invitationParamsSchema = labParamsSchema.extend({
  invitationId: z.string().uuid('must be an invitation id'),
});

export const memberSchema = z
  .object({
    id: z.string().uuid().describe('Membership id'),
    userId: z.string().uuid(),
    name: z.string(),
    email: z.string(),
    role: roleSchema,
    joinedAt: z.string(),
  })
  .meta({ id: 'Member' });

export const pendingInvitationSchema = z
  .object({
    id: z.string().uuid(),
    email: z.string(),
    role: roleSchema,
    invitedBy: z.string(),
    createdAt: z.string(),
    expiresAt: z.string(),
  })
  .meta({ id: 'PendingInvitation' });

export const membersListSchema = z
  .object({ members: z.array(memberSchema), invitations: z.array(pendingInvitationSchema) })
  .meta({ id: 'MembersList' });

export const inviteMemberSchema = z
  .object({ email: z.string().trim().toLowerCase().email('must be an e-mail address').max(254), role: roleSchema })
  .meta({ id: 'InviteMember' });

export const changeRoleSchema = z.object({ role: roleSchema }).meta({ id: 'ChangeRole' });

export const caughtMailSchema = z
  .object({
    id: z.string().uuid(),
    from: z.string(),
    to: z.array(z.string()),
    subject: z.string(),
    text: z.string(),
    html: z.string().nullable(),
    receivedAt: z.string(),
  })
  .meta({ id: 'CaughtMail' });

export const caughtMailListSchema = z
  .object({ items: z.array(caughtMailSchema), total: z.number().int() })
  .meta({ id: 'CaughtMailList' });

export const paginationQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});

export type Member = z.infer<typeof memberSchema>;
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;
export type MembersList = z.infer<typeof membersListSchema>;
export type InviteMemberInput = z.infer<typeof inviteMemberSchema>;
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;
export type CaughtMail = z.infer<typeof caughtMailSchema>;
export type CaughtMailList = z.infer<typeof caughtMailListSchema>;
