/**
 * A budget's outcome: the verdict with the caution beside it, the figures it came from (combined
 * linewidth, Δν·T_s, the published tolerance and its source, the margin, the residual phase error after
 * carrier recovery) and the table across symbol rates.
 */
import type { LinkBudgetEvaluation } from '../../../../server/contracts/link-budgets';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { cn } from '../../../components/ui/cn';
import { formatFixed, formatScientific, formatSI } from '../../../lib/units';

const RECOVERY_TEXT = (r: LinkBudgetEvaluation['carrierRecovery']) =>
  !r ? null : r.kind === 'block-average' ? `feed-forward block estimator, M = ${r.blockLength} symbols` : `first-order loop, f_c = ${formatSI(r.bandwidthHz, 'Hz').text}`;

function Verdict({ result }: { result: LinkBudgetEvaluation }) {
  const tone = result.pass === null ? 'border-caution/50 bg-caution-soft' : result.pass ? 'border-ok/50 bg-ok-soft' : 'border-danger/50 bg-danger-soft';
  const word = result.pass === null ? 'No verdict' : result.pass ? 'Within tolerance' : 'Exceeds tolerance';
  return (
    <div role="status" className={cn('rounded-[4px] border px-4 py-3', tone)} data-testid="budget-verdict">
      <p className="text-base font-semibold text-ink">{word}</p>
      <p className="mt-1 text-sm text-ink-soft">{result.verdict}</p>
      {result.toleranceProduct === null && (
        <p className="mt-1 text-sm text-ink-soft">
          No published tolerance for {result.format} was verified for Phaseloom, so no number is given rather than an invented one; Δν·T_s is still
          shown for your own criterion.
        </p>
      )}
    </div>
  );
}

function Row({ label, children, note }: { label: string; children: React.ReactNode; note?: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[minmax(9rem,14rem)_1fr] gap-x-4 gap-y-0.5 border-b border-rule/70 py-2 text-sm">
      <dt className="text-ink-faint">{label}</dt>
      <dd className="text-ink">
        {children}
        {note && <div className="text-xs text-ink-faint">{note}</div>}
      </dd>
    </div>
  );
}

export function LinkBudgetResult({ result }: { result: LinkBudgetEvaluation }) {
  const recovery = RECOVERY_TEXT(result.carrierRecovery);
  return (
    <div className="flex flex-col gap-5">
      <Verdict result={result} />
      <p className="rounded-[4px] border border-caution/40 bg-caution-soft/60 px-4 py-3 text-sm leading-relaxed text-ink-soft" data-testid="budget-caution">
        <span className="font-semibold text-caution">Caution. </span>
        {result.caution}
      </p>
      {result.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-caution">
          {result.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      <dl>
        <Row
          label="Combined linewidth Δν"
          note={result.linewidthBasis === 'equivalent-wiener' ? 'equivalent Wiener linewidth: the Lorentzian pair that leaves the same residual error with this estimator' : 'sum of the Lorentzian linewidths of transmitter and local oscillator'}
        >
          <Quantity q={formatSI(result.combinedLinewidthHz, 'Hz')} />
        </Row>
        <Row label="Δν·T_s">
          <Quantity q={formatScientific(result.linewidthSymbolProduct, '', 3)} />
        </Row>
        <Row label="Published tolerance (≈ 1 dB)" note={<>{result.toleranceSource}{result.toleranceCriterion ? ` — ${result.toleranceCriterion}` : ''}</>}>
          {result.toleranceProduct === null ? <span className="text-ink-faint">none verified</span> : <Quantity q={formatScientific(result.toleranceProduct, '', 2)} />}
        </Row>
        <Row label="Margin">
          {result.marginFactor === null || result.marginDb === null ? (
            <span className="text-ink-faint">—</span>
          ) : (
            <>
              <Mono>×{result.marginFactor.toPrecision(3)}</Mono> · <Quantity q={formatFixed(result.marginDb, 'dB', 2)} />
            </>
          )}
        </Row>
        <Row label="Phase increment per symbol σ_p²" note="2πΔνT_s (Wiener phase)">
          <Quantity q={formatScientific(result.phaseIncrementVarianceRad2, 'rad²', 3)} />
        </Row>
        {result.residualPhaseErrorRad2 !== undefined && (
          <Row label="Residual phase error σ_e²" note={`after carrier recovery (${recovery}), from the ${result.linewidthBasis === 'equivalent-wiener' ? 'measured S_ν' : 'Lorentzian lasers'}; additive noise not included`}>
            <Quantity q={formatScientific(result.residualPhaseErrorRad2, 'rad²', 3)} />
          </Row>
        )}
      </dl>
      <div>
        <h3 className="text-sm font-semibold text-ink">Across symbol rates</h3>
        <p className="text-xs text-ink-faint">The same lasers and estimator settings at other symbol rates.</p>
        <table className="mt-2 w-full text-sm" data-testid="budget-table">
          <thead>
            <tr className="border-b border-rule text-left text-ink-faint">
              <th className="py-1.5 pr-3 font-medium">Symbol rate</th>
              <th className="py-1.5 pr-3 font-medium">Δν</th>
              <th className="py-1.5 pr-3 font-medium">Δν·T_s</th>
              <th className="py-1.5 pr-3 font-medium">Margin</th>
              {result.residualPhaseErrorRad2 !== undefined && <th className="py-1.5 pr-3 font-medium">σ_e²</th>}
              <th className="py-1.5 font-medium">Verdict</th>
            </tr>
          </thead>
          <tbody>
            {result.table.map((row) => (
              <tr key={row.symbolRateBaud} className={cn('border-b border-rule/60', row.symbolRateBaud === result.symbolRateBaud && 'bg-paper-deep/60')}>
                <td className="py-1.5 pr-3">
                  <Quantity q={formatSI(row.symbolRateBaud, 'Bd')} />
                </td>
                <td className="py-1.5 pr-3">
                  <Quantity q={formatSI(row.combinedLinewidthHz, 'Hz')} />
                </td>
                <td className="py-1.5 pr-3">
                  <Quantity q={formatScientific(row.linewidthSymbolProduct, '', 3)} />
                </td>
                <td className="py-1.5 pr-3">{row.marginDb === null ? <span className="text-ink-faint">—</span> : <Quantity q={formatFixed(row.marginDb, 'dB', 1)} />}</td>
                {result.residualPhaseErrorRad2 !== undefined && (
                  <td className="py-1.5 pr-3">{row.residualPhaseErrorRad2 === undefined ? '—' : <Quantity q={formatScientific(row.residualPhaseErrorRad2, 'rad²', 2)} />}</td>
                )}
                <td className={cn('py-1.5', row.pass === true && 'text-ok', row.pass === false && 'text-danger', row.pass === null && 'text-ink-faint')}>
                  {row.pass === null ? 'no tolerance' : row.pass ? 'within' : 'exceeds'}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
