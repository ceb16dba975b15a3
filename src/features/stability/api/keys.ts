/** Query keys of the stability feature, general → specific. */
export const stabilityKeys = {
  all: ['stability'] as const,
  allan: (analysisId: string) => [...stabilityKeys.all, 'allan', analysisId] as const,
};
