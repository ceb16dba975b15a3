/**
 * The figures of a spectrum, each with its unit and what it came from: the intrinsic linewidth
 * (π × the white floor, with the band; and, while the band on the plot has been moved, the same
 * figure from the displayed series over the new band), the β-line integrated linewidth for an
 * observation time that can be edited (which runs the analysis again), the lineshape FWHM with a
 * small plot of the line, the noise-model coefficients with the 1/f corner, and the spurs.
 */
import { useEffect, useState, type ReactNode } from 'react';
import { LineshapePlot } from '../../../components/plots/lineshape-plot';
import { groupSpurs, type BandMean } from '../../../components/plots/spectrum-math';
import { Button } from '../../../components/ui/button';
import { cn } from '../../../components/ui/cn';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { formatFixed, formatScientific, formatSI } from '../../../lib/units';
import type { ReadResult } from './result-fields';

export interface LineshapeDisplay {
  offsetHz: number[];
  power: number[];
  fwhmHz: number | null;
}

export interface FiguresPanelProps {
  r: ReadResult;
  /** the analysis fixed its band (true) or found it (false) */
  bandGiven: boolean;
  /** the band on the plot, when moved away from the analysis's band */
  movedBand: readonly [number, number] | null;
  movedEstimate: BandMean | null;
  onResetBand: () => void;
  onRunWithBand: () => void;
  onRunWithObservationTime: (seconds: number) => void;
  canWrite: boolean;
  running: boolean;
  lineshape: LineshapeDisplay | null | 'computing';
}

const hz = (v: number | null | undefined) => formatSI(v ?? Number.NaN, 'Hz');
const band = (b: readonly [number, number]) => `${hz(b[0]).text} – ${hz(b[1]).text}`;

function Block({ label, testId, children, className }: { label: ReactNode; testId?: string; children: ReactNode; className?: string }) {
  return (
    <section className={cn('min-w-0 border-t border-rule pt-4', className)} data-testid={testId}>
      <h3 className="text-sm font-semibold text-ink-soft">{label}</h3>
      <div className="mt-2">{children}</div>
    </section>
  );
}

function Big({ value, testId, title }: { value: number | null | undefined; testId?: string; title?: string }) {
  return (
    <p className="text-[1.75rem] leading-tight text-ink" data-testid={testId} title={title}>
      <Quantity q={hz(value)} />
    </p>
  );
}

function From({ children }: { children: ReactNode }) {
  return <p className="mt-1.5 text-xs leading-relaxed text-ink-faint">{children}</p>;
}

export function FiguresPanel({
  r,
  bandGiven,
  movedBand,
  movedEstimate,
  onResetBand,
  onRunWithBand,
  onRunWithObservationTime,
  canWrite,
  running,
  lineshape,
}: FiguresPanelProps) {
  const t0 = r.beta.observationTimeS;
  const [t0Text, setT0Text] = useState(() => formatFixed(t0 * 1000, '', 6, true).number);
  useEffect(() => setT0Text(formatFixed(t0 * 1000, '', 6, true).number), [t0]);
  const t0Ms = Number(t0Text.trim().replace(',', '.'));
  const t0Valid = Number.isFinite(t0Ms) && t0Ms > 0;
  const t0Changed = t0Valid && Math.abs(t0Ms / 1000 - t0) > 1e-12 * t0;

  return (
    <div className="grid grid-cols-2 gap-x-10 gap-y-7" data-testid="figures-panel">
      <Block label="Intrinsic linewidth" testId="figure-intrinsic">
        <Big value={r.intrinsicLinewidthHz} testId="intrinsic-linewidth" title="Lorentzian FWHM π·Sν,white" />
        <From>
          π × white floor{' '}
          <Mono className="text-ink-soft">{formatScientific(r.floorHz2PerHz ?? Number.NaN, 'Hz²/Hz', 3).text}</Mono>
          {r.floorBandHz && (
            <>
              {' '}
              over <Mono className="text-ink-soft">{band(r.floorBandHz)}</Mono> ({bandGiven ? 'band as set' : 'flattest band, found'})
            </>
          )}
        </From>
        {movedBand && movedEstimate && (
          <div className="mt-3 rounded-[3px] border border-trace-sky/60 bg-trace-sky/10 px-3 py-2.5" data-testid="band-estimate" aria-live="polite">
            <p className="text-sm text-ink">
              Band on the plot <Mono>{band(movedBand)}</Mono>:{' '}
              <Quantity q={hz(movedEstimate.intrinsicLinewidthHz)} className="font-medium" />
            </p>
            <p className="mt-0.5 text-xs text-ink-faint">
              π × mean of the <Mono>{movedEstimate.pointCount}</Mono> displayed points in the band — a preview; the analysis averages its own
              spectrum.
            </p>
            <div className="mt-2 flex flex-wrap gap-3">
              {canWrite && (
                <Button size="sm" variant="secondary" onClick={onRunWithBand} disabled={running || movedEstimate.pointCount === 0}>
                  Run analysis with this band
                </Button>
              )}
              <Button size="sm" variant="quiet" onClick={onResetBand}>
                Back to the analysis band
              </Button>
            </div>
          </div>
        )}
      </Block>

      <Block label="Integrated linewidth · β-line" testId="figure-beta">
        <Big value={r.beta.linewidthHz} testId="beta-linewidth" title="√(8 ln2 · A), A = area of S<sub>ν</sub> above β(f) from 1/T₀" />
        <form
          className="mt-2 flex flex-wrap items-center gap-2 text-xs text-ink-faint"
          onSubmit={(e) => {
            e.preventDefault();
            if (t0Changed) onRunWithObservationTime(t0Ms / 1000);
          }}
        >
          <label className="flex items-center gap-2">
            observation time T₀
            <span className="relative">
              <input
                value={t0Text}
                onChange={(e) => setT0Text(e.currentTarget.value)}
                inputMode="decimal"
                disabled={!canWrite}
                aria-invalid={!t0Valid || undefined}
                className="h-8 w-28 rounded-[3px] border border-rule-strong bg-paper-card pr-8 pl-2 font-mono text-sm text-ink focus:border-accent disabled:opacity-70"
                data-testid="observation-time"
              />
              <span className="pointer-events-none absolute inset-y-0 right-2 flex items-center font-mono text-xs text-ink-faint">ms</span>
            </span>
          </label>
          {canWrite && t0Changed && (
            <Button type="submit" size="sm" variant="secondary" disabled={running}>
              Run again with this T₀
            </Button>
          )}
        </form>
        <From>
          area of S<sub>ν</sub> above β(f) = 8 ln2·f/π² from 1/T₀ ={' '}
          <Mono className="text-ink-soft">{hz(1 / t0).text}</Mono>
          {r.beta.areaHz2 !== null && (
            <>
              , A = <Mono className="text-ink-soft">{formatScientific(r.beta.areaHz2, 'Hz²', 3).text}</Mono>
            </>
          )}
          {r.beta.crossingHz !== null && (
            <>
              ; S<sub>ν</sub> crosses β at <Mono className="text-ink-soft">{hz(r.beta.crossingHz).text}</Mono>
            </>
          )}
          . Di Domenico, Schilt &amp; Thomann, Appl. Opt. 49, 4801 (2010).
        </From>
      </Block>

      <Block label="Lineshape FWHM" testId="figure-lineshape">
        <div className="flex items-start gap-5">
          <div className="min-w-0">
            <Big value={r.fwhmHz} testId="lineshape-fwhm" />
            <From>
              {r.fwhmHz === null ? 'No FWHM: at this T₀ the line is a coherent carrier on a pedestal. ' : ''}
              The line computed from the whole S<sub>ν</sub> above 1/T₀ (Elliott, Roy &amp; Smith, Phys. Rev. A 26, 12, 1982).
            </From>
          </div>
        </div>
        <div className="mt-3">
          {lineshape === 'computing' ? (
            <p className="text-xs text-ink-faint">Drawing the line…</p>
          ) : lineshape && lineshape.offsetHz.length > 1 ? (
            <LineshapePlot offsetHz={lineshape.offsetHz} power={lineshape.power} fwhmHz={r.fwhmHz ?? lineshape.fwhmHz} width={300} height={140} label="Lineshape computed from the displayed Sν, FWHM marked" />
          ) : null}
        </div>
      </Block>

      <Block label="Noise model" testId="figure-model">
        {r.model ? (
          <>
            <p className="text-sm text-ink-soft">
              S<sub>ν</sub>(f) = a₀ + a₋₁/f + a₋₂/f²
            </p>
            <dl className="mt-2 grid grid-cols-[4.5rem_minmax(0,1fr)] gap-x-3 gap-y-1 text-sm">
              <dt className="text-ink-faint">a₀</dt>
              <dd>
                <Quantity q={formatScientific(r.model.whiteHz2PerHz, 'Hz²/Hz', 3)} />
              </dd>
              <dt className="text-ink-faint">a₋₁</dt>
              <dd>
                <Quantity q={formatScientific(r.model.flickerHz2, 'Hz²', 3)} />
              </dd>
              <dt className="text-ink-faint">a₋₂</dt>
              <dd>
                <Quantity q={formatScientific(r.model.randomWalkHz3, 'Hz³', 3)} />
              </dd>
              <dt className="text-ink-faint">1/f corner</dt>
              <dd data-testid="model-corner">
                {r.model.cornerHz !== null ? <Quantity q={hz(r.model.cornerHz)} /> : <span className="text-ink-faint">none (no flicker term)</span>}
              </dd>
            </dl>
            <From>
              Weighted least squares on the log-frequency spectrum{r.model.bandHz ? <> over <Mono className="text-ink-soft">{band(r.model.bandHz)}</Mono></> : null};
              the corner is where a₋₁/f = a₀.
            </From>
          </>
        ) : (
          <p className="text-sm text-ink-faint">No model could be fitted to this spectrum.</p>
        )}
      </Block>

      {(r.spurs.length > 0 || r.warnings.length > 0) && (
        <div className="col-span-2 grid grid-cols-2 gap-x-10">
          <Block label={`Spurs above the model · ${r.spurs.length}`} testId="figure-spurs">
            {r.spurs.length === 0 ? (
              <p className="text-sm text-ink-faint">None stand 10 dB above the model.</p>
            ) : (
              <ul className="flex flex-col gap-1 text-sm">
                {groupSpurs(r.spurs)
                  .sort((a, b) => b.heightDb - a.heightDb)
                  .slice(0, 8)
                  .map((g) => (
                    <li key={g.frequencyHz} className="flex items-baseline justify-between gap-4 border-b border-rule/60 pb-1">
                      <span>
                        <Mono>{hz(g.frequencyHz).text}</Mono>
                        {g.count > 1 && (
                          <span className="text-xs text-ink-faint">
                            {' '}
                            · {g.count} lines, <Mono>{hz(g.loHz).text}</Mono>–<Mono>{hz(g.hiHz).text}</Mono>
                          </span>
                        )}
                      </span>
                      <Mono className="text-ink-soft">+{formatFixed(g.heightDb, 'dB', 1).text}</Mono>
                    </li>
                  ))}
              </ul>
            )}
          </Block>
          {r.warnings.length > 0 && (
            <Block label="The engine notes" testId="figure-warnings">
              <ul className="list-disc space-y-1 pl-4 text-sm text-caution">
                {r.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            </Block>
          )}
        </div>
      )}
    </div>
  );
}
