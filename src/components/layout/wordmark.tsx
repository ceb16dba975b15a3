import { cn } from '../ui/cn';

/**
 * Phaseloom's mark: two phase traces crossing like threads on a loom, drawn in ink and accent.
 */
export function Wordmark({ className, size = 'md' }: { className?: string; size?: 'md' | 'lg' }) {
  const px = size === 'lg' ? 30 : 24;
  return (
    <span className={cn('inline-flex items-center gap-2.5', className)}>
      <svg width={px} height={px} viewBox="0 0 24 24" aria-hidden="true" className="shrink-0">
        <rect x="0.75" y="0.75" width="22.5" height="22.5" rx="3" fill="none" stroke="currentColor" strokeOpacity="0.28" strokeWidth="1" />
        <path d="M3 12c2.2-5 4.4-5 6.6 0s4.4 5 6.6 0 3.3-4.2 4.8-2.4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        <path d="M3 12c2.2 5 4.4 5 6.6 0s4.4-5 6.6 0 3.3 4.2 4.8 2.4" fill="none" stroke="#0b5f8a" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
      <span className={cn('font-semibold tracking-tight text-ink', size === 'lg' ? 'text-xl' : 'text-[1.0625rem]')}>Phaseloom</span>
    </span>
  );
}
