/** Query keys of the invitations feature, general → specific. */
export const invitationKeys = {
  all: ['invitations'] as const,
  ofBench: (benchId: string) => [...invitationKeys.all, 'bench', benchId] as const,
  preview: (token: string) => [...invitationKeys.all, 'preview', token] as const,
};
