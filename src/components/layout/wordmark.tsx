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
        <path d="M4 12C7 4.5 9 4.5 12 12S17 19.5 20 12" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" />
        <path d="M4 12C7 19.5 9 19.5 12 12S17 4.5 20 12" fill="none" stroke="#0b5f8a" strokeWidth="1.5" strokeLinecap="round" />
      </svg>
      <span className={cn('font-semibold tracking-tight text-ink', size === 'lg' ? 'text-xl' : 'text-[1.0625rem]')}>Phaseloom</span>
    </span>
  );
}
