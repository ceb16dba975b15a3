/** The estimator's figures, with what they assume and what is from memory beside them. */
import type { LaserEstimateResponse } from '../../../../server/contracts/laser-estimates';
import { Quantity } from '../../../components/ui/quantity';
import { formatFixed, formatScientific, formatSI } from '../../../lib/units';

function Row({ label, children, note }: { label: string; children: React.ReactNode; note?: string }) {
  return (
    <div className="grid grid-cols-[minmax(10rem,15rem)_1fr] gap-x-4 border-b border-rule/70 py-2 text-sm">
      <dt className="text-ink-faint">{label}</dt>
      <dd className="text-ink">
        {children}
        {note && <div className="text-xs text-ink-faint">{note}</div>}
      </dd>
    </div>
  );
}

export function EstimateFigures({ estimate }: { estimate: LaserEstimateResponse }) {
  return (
    <div className="flex flex-col gap-4" data-testid="laser-estimate">
      <dl>
        <Row label="α-enhanced (Henry) linewidth" note="Δν_ST·(1 + α²) — Henry’s formula, details from memory">
          <Quantity q={formatSI(estimate.enhancedLinewidthHz, 'Hz')} className="text-base font-semibold" />
        </Row>
        <Row label="Schawlow–Townes linewidth" note="π hν Δν_c² n_sp η₀ / P_out (α = 0)">
          <Quantity q={formatSI(estimate.schawlowTownesLinewidthHz, 'Hz')} />
        </Row>
        <Row label="Cold-cavity linewidth Δν_c" note="v_g g_th / 2π">
          <Quantity q={formatSI(estimate.coldCavityLinewidthHz, 'Hz')} />
        </Row>
        <Row label="Mirror loss α_m · threshold gain g_th">
          <Quantity q={formatFixed(estimate.mirrorLossPerCm, '/cm', 2)} /> · <Quantity q={formatFixed(estimate.thresholdGainPerCm, '/cm', 2)} />
        </Row>
        <Row label="Optical efficiency η₀">
          <Quantity q={formatFixed(estimate.opticalEfficiency, '', 3)} />
        </Row>
        <Row label="Total output P_out" note={`facet 1 carries ${(estimate.outputFacetShare * 100).toFixed(1)} % of it`}>
          <Quantity q={formatSI(estimate.totalOutputPowerMw * 1e-3, 'W')} />
        </Row>
        <Row label="Photons in the cavity">
          <Quantity q={formatScientific(estimate.photonNumber, '', 3)} />
        </Row>
      </dl>
      <div className="text-xs leading-relaxed text-ink-faint">
        <p className="font-medium text-ink-soft">Assumptions</p>
        <ul className="list-disc pl-5">
          {estimate.assumptions.map((a) => (
            <li key={a}>{a}</li>
          ))}
        </ul>
        <p className="mt-2 font-medium text-ink-soft">From memory, not verified against the sources</p>
        <ul className="list-disc pl-5">
          {estimate.fromMemory.map((a) => (
            <li key={a}>{a}</li>
          ))}
        </ul>
      </div>
    </div>
  );
}
