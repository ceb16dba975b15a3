/** Query keys of the overlays feature, general → specific. */
export const overlayKeys = {
  all: ['overlays'] as const,
  lists: () => [...overlayKeys.all, 'list'] as const,
  list: (benchId: string) => [...overlayKeys.lists(), benchId] as const,
  details: () => [...overlayKeys.all, 'detail'] as const,
  detail: (overlayId: string) => [...overlayKeys.details(), overlayId] as const,
};
