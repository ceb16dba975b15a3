import { cn } from '../ui/cn';

/** The laser-safety caution from the product brief, for pages that discuss setups and captures. */
export function LaserSafetyNote({ className }: { className?: string }) {
  return (
    <p className={cn('flex items-start gap-2.5 text-xs leading-relaxed text-caution', className)}>
      <svg width="14" height="14" viewBox="0 0 16 16" aria-hidden="true" className="mt-px shrink-0">
        <path d="M8 1.5 15 14H1z" fill="none" stroke="currentColor" strokeWidth="1.3" strokeLinejoin="round" />
        <path d="M8 6v4M8 11.6v.4" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" />
      </svg>
      <span>
        <span className="font-medium">Laser safety.</span> Measurement setups involve laser radiation: follow your site's
        laser-safety rules and the classification of your sources (IEC 60825-1).
      </span>
    </p>
  );
}
