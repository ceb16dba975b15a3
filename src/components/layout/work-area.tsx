import type { ReactNode } from 'react';
import { cn } from '../ui/cn';

export interface WorkAreaProps {
  main: ReactNode;
  side: ReactNode;
  className?: string;
}

/** A page's working area: the record (a list) first, a narrow column of forms and notes beside it. */
export function WorkArea({ main, side, className }: WorkAreaProps) {
  return (
    <div className={cn('grid grid-cols-[minmax(0,1fr)_20rem] gap-14', className)}>
      <div className="min-w-0">{main}</div>
      <aside className="flex min-w-0 flex-col gap-8">{side}</aside>
    </div>
  );
}
