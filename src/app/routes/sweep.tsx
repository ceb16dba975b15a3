/**
 * /benches/:benchId/lasers/:laserId/sweep?parameter= — a laser's intrinsic and β-line linewidths
 * against drive current, output power or temperature across its captures (latest done analysis of
 * each); for output power the fit Δν = a/P + Δν₀ (slope, power-independent floor, r²).
 */
import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { SWEEP_PARAMETERS, SweepParameter, type SweepFitOutcome } from '../../../server/contracts/sweeps';
import { PageHeader } from '../../components/layout/page-header';
import { Mono, Quantity } from '../../components/ui/quantity';
import { Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { formatFixed, formatSI } from '../../lib/units';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { sweepQueryOptions, useSweep } from '../../features/sweeps/api/get-sweep';
import { SweepPlot } from '../../features/sweeps/components/sweep-plot';

function parameterOf(search: URLSearchParams): SweepParameter {
  const parsed = SweepParameter.safeParse(search.get('parameter'));
  return parsed.success ? parsed.data : 'outputPowerMw';
}

export const sweepLoader =
  (queryClient: QueryClient) =>
  async ({ params, request }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    const parameter = parameterOf(new URL(request.url).searchParams);
    await Promise.all([queryClient.ensureQueryData(benchQueryOptions(benchId)), queryClient.ensureQueryData(sweepQueryOptions(benchId, params.laserId ?? '', parameter))]);
    return null;
  };

const AXIS_TITLE: Record<SweepParameter, string> = {
  driveCurrentMa: 'Drive current I (mA)',
  outputPowerMw: 'Output power P (mW)',
  temperatureC: 'Temperature T (°C)',
};

function FitSummary({ title, outcome }: { title: string; outcome: SweepFitOutcome }) {
  if (!outcome.fit) {
    return (
      <div className="text-sm">
        <p className="font-medium text-ink">{title}</p>
        <p className="mt-1 text-ink-soft" data-testid="sweep-no-fit">
          No fit: {outcome.reason}
        </p>
      </div>
    );
  }
  const f = outcome.fit;
  return (
    <div className="text-sm" data-testid="sweep-fit">
      <p className="font-medium text-ink">{title}: Δν = a/P + Δν₀</p>
      <dl className="mt-1 grid grid-cols-[15rem_1fr] gap-y-1">
        <dt className="text-ink-soft">slope a</dt>
        <dd>
          <Quantity q={formatSI(f.slopeHzW, 'Hz·W', { significant: 4 })} /> <span className="text-ink-faint">± {formatSI(f.slopeUncertaintyHzW, 'Hz·W').text}</span>
        </dd>
        <dt className="text-ink-soft">power-independent floor Δν₀</dt>
        <dd>
          <Quantity q={formatSI(f.floorHz, 'Hz', { significant: 4 })} /> <span className="text-ink-faint">± {formatSI(f.floorUncertaintyHz, 'Hz').text}</span>
        </dd>
        <dt className="text-ink-soft">r²</dt>
        <dd>
          <Mono>{f.r2.toFixed(4)}</Mono> <span className="text-ink-faint">({f.points} points)</span>
        </dd>
      </dl>
      {f.warnings.map((w) => (
        <p key={w} className="mt-1 text-caution">
          {w}
        </p>
      ))}
    </div>
  );
}

export function SweepRoute() {
  const { benchId = '', laserId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const parameter = parameterOf(search);
  const bench = useBench(benchId);
  const sweep = useSweep(benchId, laserId, parameter);
  const unit = SWEEP_PARAMETERS[parameter].unit;

  return (
    <>
      <title>{`Sweep · ${sweep.laser.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: sweep.laser.name, to: paths.benches.laser.getHref(bench.id, sweep.laser.id) },
          { label: 'Sweep' },
        ]}
        title={`${sweep.laser.name}: linewidth against ${SWEEP_PARAMETERS[parameter].label.toLowerCase()}`}
        lede="Each point is a capture's latest finished analysis."
      />
      <div className="mt-8 flex flex-wrap gap-2" role="group" aria-label="Operating parameter">
        {SweepParameter.options.map((p) => (
          <button
            key={p}
            type="button"
            aria-pressed={p === parameter}
            onClick={() => setSearch({ parameter: p }, { replace: true })}
            className={`h-8 rounded-[3px] border px-3 text-sm ${p === parameter ? 'border-accent bg-accent-soft text-ink' : 'border-rule bg-paper-card text-ink-soft hover:text-ink'}`}
          >
            {SWEEP_PARAMETERS[p].label} ({SWEEP_PARAMETERS[p].unit})
          </button>
        ))}
      </div>
      <div className="mt-6">
        <SweepPlot
          points={sweep.points}
          xTitle={AXIS_TITLE[parameter]}
          unit={unit}
          fits={{ intrinsic: sweep.fits.intrinsic.fit, beta: sweep.fits.beta.fit }}
          label={`Linewidths of ${sweep.laser.name} against ${SWEEP_PARAMETERS[parameter].label.toLowerCase()}`}
        />
        {sweep.withoutParameter > 0 && (
          <p className="mt-2 text-sm text-ink-faint">
            {sweep.withoutParameter} analysed capture{sweep.withoutParameter === 1 ? '' : 's'} of this laser do not state {SWEEP_PARAMETERS[parameter].label.toLowerCase()} and are left out.
          </p>
        )}
      </div>
      <div className="mt-8 grid gap-8 md:grid-cols-2">
        <FitSummary title="Intrinsic linewidth" outcome={sweep.fits.intrinsic} />
        <FitSummary title="β-line linewidth" outcome={sweep.fits.beta} />
      </div>
      <Section id="sweep-points" className="mt-10" title="Points">
        <table className="w-full text-sm">
          <thead>
            <tr className="border-b border-rule text-left text-xs tracking-[0.06em] text-ink-faint uppercase">
              <th className="py-2 font-medium">Capture</th>
              <th className="py-2 text-right font-medium">{`${SWEEP_PARAMETERS[parameter].label} (${unit})`}</th>
              <th className="py-2 text-right font-medium">Intrinsic</th>
              <th className="py-2 text-right font-medium">β-line</th>
            </tr>
          </thead>
          <tbody>
            {sweep.points.map((p) => (
              <tr key={p.captureId} className="border-b border-rule/60">
                <td className="py-1.5">
                  <Link to={paths.benches.spectrum.getHref(bench.id, p.analysisId)} className="text-accent underline-offset-4 hover:underline">
                    {p.fileName}
                  </Link>
                </td>
                <td className="py-1.5 text-right">
                  <Quantity q={formatFixed(p.x, unit, 3, true)} />
                </td>
                <td className="py-1.5 text-right">{p.intrinsicLinewidthHz === null ? '—' : <Quantity q={formatSI(p.intrinsicLinewidthHz, 'Hz')} />}</td>
                <td className="py-1.5 text-right">{p.betaLinewidthHz === null ? '—' : <Quantity q={formatSI(p.betaLinewidthHz, 'Hz')} />}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>
    </>
  );
}
