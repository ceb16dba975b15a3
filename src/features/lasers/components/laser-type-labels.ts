import type { LaserType } from '../../../../server/contracts/lasers';

/** How each laser type reads on a page (trade abbreviations kept as the trade writes them). */
export const LASER_TYPE_LABELS: Record<LaserType, string> = {
  dfb: 'DFB',
  dbr: 'DBR',
  'external-cavity': 'External cavity',
  fibre: 'Fibre',
  vcsel: 'VCSEL',
  other: 'Other',
};
