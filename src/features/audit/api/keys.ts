/** Query keys of the audit feature, general → specific. */
export const auditKeys = {
  all: ['audit'] as const,
  list: (benchId: string, filters: object) => [...auditKeys.all, benchId, filters] as const,
};
