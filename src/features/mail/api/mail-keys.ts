export interface MailPage {
  page: number;
  pageSize: number;
}

export const mailKeys = {
  all: ['caught-mail'] as const,
  list: (page: MailPage) => [...mailKeys.all, page] as const,
};
