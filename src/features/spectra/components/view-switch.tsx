/** The four views of a spectrum as one radio group (arrow keys move between them). */
import { useId } from 'react';
import { HtmlSymbol } from '../../../components/plots/plot-text';
import { VIEW_INFO, VIEWS, type SpectrumView } from '../../../components/plots/spectrum-math';
import { cn } from '../../../components/ui/cn';

export function ViewSwitch({ view, onChange }: { view: SpectrumView; onChange: (v: SpectrumView) => void }) {
  const name = useId();
  return (
    <fieldset className="flex items-center gap-3">
      <legend className="sr-only">View</legend>
      <span aria-hidden="true" className="text-xs font-medium tracking-[0.08em] text-ink-faint uppercase">
        View
      </span>
      <div className="flex rounded-[3px] border border-rule-strong bg-paper-card p-0.5">
        {VIEWS.map((v) => {
          const info = VIEW_INFO[v];
          const checked = v === view;
          return (
            <label
              key={v}
              title={`${info.name} (${info.unit})`}
              className={cn(
                'relative cursor-pointer rounded-[2px] px-3 py-1 text-sm transition-colors has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent',
                checked ? 'bg-ink text-paper-card' : 'text-ink-soft hover:bg-paper-deep hover:text-ink',
              )}
            >
              <input type="radio" name={name} value={v} checked={checked} onChange={() => onChange(v)} className="sr-only" aria-label={`${info.symbol.replace('_', '')} — ${info.name} (${info.unit})`} />
              <span aria-hidden="true" className="font-medium">
                <HtmlSymbol text={info.symbol} />
              </span>{' '}
              <span aria-hidden="true" className={cn('font-mono text-xs', checked ? 'text-paper-deep' : 'text-ink-faint')}>
                {info.unit}
              </span>
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
