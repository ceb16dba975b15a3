import type { ReactNode } from 'react';
import { cn } from '../ui/cn';

export interface WorkAreaProps {
  main: ReactNode;
  side: ReactNode;
  /**
   * 'wide-main' puts the side column beside the main one only from 1280 px on and below the main
   * one under that (for tables that need the width); 'always' keeps it beside at every width.
   */
  sideBy?: 'wide-main' | 'always';
  className?: string;
}

/** A page's working area: the record (list, table) first, a narrow column of forms and notes beside it. */
export function WorkArea({ main, side, sideBy = 'wide-main', className }: WorkAreaProps) {
  return (
    <div
      className={cn(
        'grid',
        sideBy === 'always'
          ? 'grid-cols-[minmax(0,1fr)_20rem] gap-14'
          : 'grid-cols-1 gap-12 xl:grid-cols-[minmax(0,1fr)_20rem] xl:gap-14',
        className,
      )}
    >
      <div className="min-w-0">{main}</div>
      <aside className="flex min-w-0 flex-col gap-8">{side}</aside>
    </div>
  );
}
