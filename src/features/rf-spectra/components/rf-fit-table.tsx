/**
 * The figures of an RF beat spectrum: each shape's FWHM with its standard uncertainty, its parts (Voigt),
 * centre and residual; the −20 dB width read as a Lorentzian and as a Gaussian; in self-heterodyne mode the
 * laser linewidth each implies, with the assumption stated and the warnings beside it.
 */
import type { RfLineFitResult, RfSelfHeterodyneReading, RfSpectrum } from '../../../../server/contracts/rf-spectra';
import { Quantity } from '../../../components/ui/quantity';
import { formatSI } from '../../../lib/units';
import { SHAPE_STYLE } from './rf-fit-plot';

const hz = (v: number | null | undefined, significant = 4) => formatSI(v ?? Number.NaN, 'Hz', { significant });

function WidthWithUncertainty({ value, uncertainty }: { value: number | null; uncertainty: number | null }) {
  if (value === null) return <span className="text-ink-faint">—</span>;
  return (
    <span className="whitespace-nowrap">
      <Quantity q={hz(value)} />
      {uncertainty !== null && (
        <span className="text-ink-faint">
          {' ± '}
          <Quantity q={hz(uncertainty, 2)} />
        </span>
      )}
    </span>
  );
}

function FitRow({ fit, best }: { fit: RfLineFitResult; best: boolean }) {
  const style = SHAPE_STYLE[fit.shape];
  return (
    <tr className="border-b border-rule align-top" data-testid={`fit-row-${fit.shape}`}>
      <th scope="row" className="py-2 pr-4 text-left font-medium">
        <span className="mr-2 inline-block h-0.5 w-4 align-middle" style={{ background: style.color }} aria-hidden="true" />
        {style.label.replace(' fit', '')}
        {best && <span className="ml-2 rounded-[3px] border border-rule-strong px-1.5 text-xs text-ink-soft">best</span>}
      </th>
      {fit.error !== null ? (
        <td colSpan={4} className="py-2 text-danger">
          did not converge: {fit.error}
        </td>
      ) : (
        <>
          <td className="py-2 pr-4">
            <WidthWithUncertainty value={fit.fwhmHz} uncertainty={fit.fwhmUncertaintyHz} />
            {fit.shape === 'voigt' && fit.exactFwhmHz !== null && (
              <div className="text-xs text-ink-faint">
                Olivero–Longbothum; exact <Quantity q={hz(fit.exactFwhmHz)} />
              </div>
            )}
          </td>
          <td className="py-2 pr-4 text-sm">
            {fit.shape === 'voigt' ? (
              <>
                <div>
                  f<sub>L</sub> <WidthWithUncertainty value={fit.lorentzianFwhmHz} uncertainty={fit.lorentzianFwhmUncertaintyHz} />
                </div>
                <div>
                  f<sub>G</sub> <WidthWithUncertainty value={fit.gaussianFwhmHz} uncertainty={fit.gaussianFwhmUncertaintyHz} />
                </div>
              </>
            ) : (
              <span className="text-ink-faint">—</span>
            )}
          </td>
          <td className="py-2 pr-4">
            <Quantity q={hz(fit.centerHz, 9)} />
          </td>
          <td className="py-2">
            <Quantity q={formatSI(fit.residualRmsMw ?? Number.NaN, 'W', { significant: 3 })} title="rms of the residual, linear power" />
            <span className="ml-2 text-xs text-ink-faint">{((fit.residualRelative ?? 0) * 100).toFixed(2)} % of peak</span>
          </td>
        </>
      )}
    </tr>
  );
}

function Reading({ label, r }: { label: string; r: RfSelfHeterodyneReading }) {
  return (
    <tr className="border-b border-rule align-top">
      <th scope="row" className="py-2 pr-4 text-left font-medium">
        {label}
      </th>
      <td className="py-2 pr-4">
        <Quantity q={hz(r.laserLinewidthHz)} />
        {r.shortDelayLinewidthHz !== null && (
          <div className="text-xs text-ink-faint">
            from the short-delay closed form: <Quantity q={hz(r.shortDelayLinewidthHz)} />
          </div>
        )}
      </td>
      <td className="py-2 pr-4 font-mono text-sm">{r.delayLinewidthProduct === null ? '—' : r.delayLinewidthProduct.toPrecision(3)}</td>
      <td className="py-2 text-sm text-ink-soft">
        {r.assumption}
        {r.warnings.map((w) => (
          <div key={w} className="mt-1 text-danger">
            {w}
          </div>
        ))}
      </td>
    </tr>
  );
}

export function RfFitTable({ spectrum }: { spectrum: RfSpectrum }) {
  const { result } = spectrum;
  const t = result.twentyDb;
  const sh = result.selfHeterodyne;
  // residuals are stored in mW; shown in W with an SI prefix
  const fits = result.fits.map((f) => ({ ...f, residualRmsMw: f.residualRmsMw === null ? null : f.residualRmsMw / 1e3 }));
  return (
    <div className="space-y-8">
      <table className="w-full border-collapse text-[0.9375rem]" data-testid="rf-fit-table">
        <caption className="pb-2 text-left text-sm text-ink-faint">
          Fits in linear power on a constant baseline; uncertainties are one standard error from the fit's covariance.
        </caption>
        <thead>
          <tr className="border-b border-rule-strong text-left text-xs tracking-wide text-ink-faint uppercase">
            <th scope="col" className="py-2 pr-4 font-medium">Line shape</th>
            <th scope="col" className="py-2 pr-4 font-medium">FWHM</th>
            <th scope="col" className="py-2 pr-4 font-medium">Parts</th>
            <th scope="col" className="py-2 pr-4 font-medium">Centre</th>
            <th scope="col" className="py-2 font-medium">Residual (rms)</th>
          </tr>
        </thead>
        <tbody>
          {fits.map((f) => (
            <FitRow key={f.shape} fit={f} best={f.shape === result.bestShape} />
          ))}
          <tr className="align-top" data-testid="twenty-db-row">
            <th scope="row" className="py-2 pr-4 text-left font-medium">
              −20 dB width
            </th>
            {t ? (
              <>
                <td className="py-2 pr-4">
                  <Quantity q={hz(t.widthHz)} />
                </td>
                <td colSpan={3} className="py-2 text-sm text-ink-soft">
                  read as a Lorentzian (÷√99): <Quantity q={hz(t.lorentzianFwhmHz)} />; as a Gaussian (÷2.578): <Quantity q={hz(t.gaussianFwhmHz)} />
                </td>
              </>
            ) : (
              <td colSpan={4} className="py-2 text-ink-faint">
                not found: the trace does not fall 20 dB below its peak on both sides
              </td>
            )}
          </tr>
        </tbody>
      </table>

      {sh && (
        <table className="w-full border-collapse text-[0.9375rem]" data-testid="rf-dsh-table">
          <caption className="pb-2 text-left text-sm text-ink-faint">
            Self-heterodyne reading: the laser linewidth from the beat (delay {spectrum.delayS !== null ? <Quantity q={formatSI(spectrum.delayS, 's')} /> : null}
            {spectrum.fiberLengthM !== null ? (
              <>
                {' '}
                fibre <Quantity q={formatSI(spectrum.fiberLengthM, 'm')} />
              </>
            ) : null}
            ).
          </caption>
          <thead>
            <tr className="border-b border-rule-strong text-left text-xs tracking-wide text-ink-faint uppercase">
              <th scope="col" className="py-2 pr-4 font-medium">From</th>
              <th scope="col" className="py-2 pr-4 font-medium">Laser linewidth</th>
              <th scope="col" className="py-2 pr-4 font-medium normal-case">τ_d·Δν</th>
              <th scope="col" className="py-2 font-medium">Assumption</th>
            </tr>
          </thead>
          <tbody>
            {(['lorentzian', 'gaussian', 'voigt'] as const).map((s) => {
              const r = sh.fromFit[s];
              return r ? <Reading key={s} label={SHAPE_STYLE[s].label} r={r} /> : null;
            })}
            {sh.fromTwentyDb && <Reading label="−20 dB width" r={sh.fromTwentyDb} />}
          </tbody>
        </table>
      )}

      {result.warnings.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-ink">Warnings</h3>
          <ul className="mt-1 list-disc pl-5 text-sm text-ink-soft" data-testid="rf-warnings">
            {result.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
