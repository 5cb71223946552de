export const membersKeys = {
  all: ['members'] as const,
  list: (labId: string) => [...membersKeys.all, 'list', labId] as const,
};
