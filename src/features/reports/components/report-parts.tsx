/**
 * Building blocks of the printed reports: the A4 sheet with its header and the laser-safety caution
 * at its foot, sections kept whole on a page, fact lists, and the number formats reports use.
 */
import type { ReactNode } from 'react';
import { LaserSafetyNote } from '../../../components/layout/laser-safety-note';
import { formatScientific, formatSI } from '../../../lib/units';
import './report-print.css';

export const hz = (v: number | null, significant = 3) => (v === null ? '—' : formatSI(v, 'Hz', { significant }).text);
export const sci = (v: number | null, unit: string) => (v === null ? '—' : formatScientific(v, unit, 3).text);
export const hzBand = (b: readonly [number, number] | null) => (b ? `${hz(b[0])} – ${hz(b[1])}` : '—');
export const mono = (text: string) => <span className="font-mono tabular-nums">{text}</span>;

export const WINDOW_NAMES: Record<string, string> = { hann: 'Hann', 'blackman-harris': 'Blackman–Harris', 'flat-top': 'flat-top' };
export const KIND_NAMES: Record<string, string> = {
  phase: 'phase (rad)',
  iq: 'IQ (I and Q)',
  beat: 'beat note (real voltage)',
  frequency: 'instantaneous frequency (Hz)',
};
export const SETUP_NAMES: Record<string, string> = {
  heterodyne: 'heterodyne against a reference laser',
  'self-heterodyne': 'delayed self-heterodyne',
  'coherent-receiver': 'coherent (IQ) receiver',
  other: 'other',
};

/** S_ν with its subscript */
export const SNu = () => (
  <>
    S<sub>ν</sub>
  </>
);
/** the white level S_ν,white */
export const SNuWhite = () => (
  <>
    S<sub>ν,white</sub>
  </>
);

export function ReportSheet({ kind, title, subtitle, testId, children }: { kind: string; title: ReactNode; subtitle: ReactNode; testId: string; children: ReactNode }) {
  return (
    <article className="report-sheet mx-auto box-content w-[180mm] bg-white px-[15mm] py-[14mm] text-ink shadow-[0_1px_3px_rgba(0,0,0,0.12)]" data-testid={testId}>
      <header className="border-b-2 border-ink pb-3">
        <p className="text-xs font-medium tracking-wide text-ink-faint uppercase">Phaseloom · {kind}</p>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight break-words" data-testid="report-title">
          {title}
        </h1>
        <p className="mt-1 text-sm text-ink-soft">{subtitle}</p>
      </header>
      {children}
      <footer className="report-keep mt-8 border-t border-rule pt-3" data-testid="report-caution">
        <LaserSafetyNote />
      </footer>
    </article>
  );
}

export function ReportSection({ title, children, testId, className }: { title: ReactNode; children: ReactNode; testId?: string; className?: string }) {
  return (
    <section className={`report-keep mt-7 ${className ?? ''}`} data-testid={testId}>
      <h2 className="border-b border-rule pb-1.5 text-[0.8125rem] font-semibold tracking-wide text-ink uppercase">{title}</h2>
      <div className="pt-2.5">{children}</div>
    </section>
  );
}

/** A two-column list of facts: term, value. */
export function Facts({ rows }: { rows: [string, ReactNode][] }) {
  return (
    <dl className="grid grid-cols-[12rem_minmax(0,1fr)] gap-x-4 gap-y-1 text-[0.8125rem] leading-snug">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="text-ink-faint">{term}</dt>
          <dd className="min-w-0 break-words text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

export function operatingPointText(p: { driveCurrentMa: number | null; temperatureC: number | null; outputPowerMw: number | null }, fixed: (v: number, unit: string, d: number) => string): string {
  const parts = [
    p.driveCurrentMa !== null && `drive current ${fixed(p.driveCurrentMa, 'mA', 2)}`,
    p.temperatureC !== null && `temperature ${fixed(p.temperatureC, '°C', 2)}`,
    p.outputPowerMw !== null && `output power ${fixed(p.outputPowerMw, 'mW', 3)}`,
  ].filter(Boolean) as string[];
  return parts.length ? parts.join(' · ') : 'not stated';
}
