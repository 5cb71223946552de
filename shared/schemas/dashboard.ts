import { z } from 'zod';

export const dashboardStudySchema = z.object({
  id: z.string(),
  title: z.string(),
  emitter: z.string(),
  quencher: z.string(),
  owner: z.string().nullable(),
  status: z.enum(['draft', 'submitted', 'approved', 'returned']),
  kq: z.number().nullable().describe('M^-1 s^-1'),
  flagged: z.boolean(),
  updatedAt: z.string(),
});

export const activitySchema = z.object({
  id: z.number().int(),
  action: z.string(),
  description: z.string().describe('the event in plain words'),
  actor: z.string().nullable(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  at: z.string(),
});

export const dashboardSchema = z
  .object({
    waitingForMyReview: z.array(dashboardStudySchema).describe('submitted studies, for reviewers and admins'),
    myReturned: z.array(dashboardStudySchema).describe('my studies returned with comments'),
    myDrafts: z.array(dashboardStudySchema).describe('my studies not yet submitted, newest change first'),
    recentlyFlagged: z.array(dashboardStudySchema),
    recentActivity: z.array(activitySchema),
  })
  .meta({ id: 'Dashboard' });

export type Dashboard = z.infer<typeof dashboardSchema>;
export type DashboardStudy = z.infer<typeof dashboardStudySchema>;
export type Activity = z.infer<typeof activitySchema>;
