export interface MailPage {
  page: number;
  pageSize: number;
}

export const mailKeys = {
  all: ['caught-mail'] as const,
  lists: (labId: string) => [...mailKeys.all, labId] as const,
  list: (labId: string, page: MailPage) => [...mailKeys.lists(labId), page] as const,
};
