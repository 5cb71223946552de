export const authKeys = {
  all: ['auth'] as const,
  session: () => [...authKeys.all, 'session'] as const,
  invitation: (token: string) => [...authKeys.all, 'invitation', token] as const,
  sessions: () => [...authKeys.all, 'account-sessions'] as const,
};
