/** Query keys of the corrections feature, general → specific. */
export const correctionKeys = {
  all: ['corrections'] as const,
  lists: () => [...correctionKeys.all, 'list'] as const,
  list: (analysisId: string) => [...correctionKeys.lists(), analysisId] as const,
  references: (benchId: string) => [...correctionKeys.all, 'references', benchId] as const,
};
