/** Query keys of the sweeps feature, general → specific. */
import type { SweepParameter } from '../../../../server/contracts/sweeps';

export const sweepKeys = {
  all: ['sweeps'] as const,
  laser: (benchId: string, laserId: string) => [...sweepKeys.all, benchId, laserId] as const,
  sweep: (benchId: string, laserId: string, parameter: SweepParameter) => [...sweepKeys.laser(benchId, laserId), parameter] as const,
};
