/** Query keys of the RF spectra feature, general → specific. */
export const rfSpectrumKeys = {
  all: ['rf-spectra'] as const,
  lists: () => [...rfSpectrumKeys.all, 'list'] as const,
  list: (benchId: string) => [...rfSpectrumKeys.lists(), benchId] as const,
  details: () => [...rfSpectrumKeys.all, 'detail'] as const,
  detail: (id: string) => [...rfSpectrumKeys.details(), id] as const,
};
