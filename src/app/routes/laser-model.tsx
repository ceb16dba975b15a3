/**
 * /benches/:benchId/lasers/:laserId/model — "Laser model": the estimator (cold-cavity, Schawlow–Townes and
 * Henry linewidths from the laser's design) beside the laser's measured sweep of intrinsic linewidth
 * against output power across its captures.
 */
import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import type { LaserEstimateResponse } from '../../../server/contracts/laser-estimates';
import { PageHeader } from '../../components/layout/page-header';
import { ButtonLink } from '../../components/ui/button';
import { Mono, Quantity } from '../../components/ui/quantity';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { errorsFromFailure, type FieldErrors } from '../../lib/form';
import { formatSI } from '../../lib/units';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { useEstimateLaser } from '../../features/laser-model/api/estimate-laser';
import { EstimateFigures } from '../../features/laser-model/components/estimate-figures';
import { EstimatorForm } from '../../features/laser-model/components/estimator-form';
import { PredictionPlot, type MeasuredPoint } from '../../features/laser-model/components/prediction-plot';
import { lasersQueryOptions, useLasers } from '../../features/lasers/api/get-lasers';
import { sweepQueryOptions, useSweep } from '../../features/sweeps/api/get-sweep';

const FIELDS = ['wavelengthNm', 'groupIndex', 'cavityLengthUm', 'facetReflectivities', 'facetReflectivities.0', 'facetReflectivities.1', 'mirrorLossPerCm', 'internalLossPerCm', 'nsp', 'alphaFactor', 'outputPowerMw'] as const;

export const laserModelLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    const laserId = params.laserId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(benchQueryOptions(benchId)),
      queryClient.ensureQueryData(lasersQueryOptions(benchId)),
      queryClient.ensureQueryData(sweepQueryOptions(benchId, laserId, 'outputPowerMw')),
    ]);
    return null;
  };

export function LaserModelRoute() {
  const { benchId = '', laserId = '' } = useParams();
  const bench = useBench(benchId);
  const lasers = useLasers(benchId);
  const sweep = useSweep(benchId, laserId, 'outputPowerMw');
  const laser = lasers.find((l) => l.id === laserId);
  const estimate = useEstimateLaser();
  const [result, setResult] = useState<{ estimate: LaserEstimateResponse; outputPowerMw: number } | null>(null);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const measured: MeasuredPoint[] = sweep.points
    .filter((p) => p.intrinsicLinewidthHz !== null && p.intrinsicLinewidthHz > 0 && p.x > 0)
    .map((p) => ({ id: p.captureId, outputPowerMw: p.x, intrinsicLinewidthHz: p.intrinsicLinewidthHz as number, label: p.fileName }));

  return (
    <>
      <title>{`Laser model · ${sweep.laser.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: sweep.laser.name, to: paths.benches.laser.getHref(bench.id, laserId) },
          { label: 'Laser model' },
        ]}
        title="Laser model"
        lede="What the laser’s design predicts — cold-cavity, Schawlow–Townes and α-enhanced (Henry) linewidths — beside what its captures measured."
        actions={<ButtonLink to={paths.benches.simulations.getHref(bench.id)}>Rate-equation simulator</ButtonLink>}
      />
      <div className="mt-10 grid grid-cols-1 gap-10 lg:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
        <Panel id="estimator" title="Laser parameters">
          <EstimatorForm
            wavelengthNm={laser?.wavelengthNm ?? null}
            busy={estimate.isPending}
            fieldErrors={fieldErrors}
            formError={formError}
            onInvalid={(e) => {
              setFieldErrors(e);
              setFormError(null);
            }}
            onValidated={(request) => {
              setFieldErrors({});
              setFormError(null);
              estimate.mutate(request, {
                onSuccess: (e) => setResult({ estimate: e, outputPowerMw: request.outputPowerMw }),
                onError: (error) => {
                  const f = errorsFromFailure(error, FIELDS);
                  setFieldErrors(f.fieldErrors);
                  setFormError(f.formError);
                },
              });
            }}
          />
        </Panel>
        <div className="flex flex-col gap-10">
          <Section id="prediction" title="Predicted and measured" lede="Intrinsic linewidth against the output power each capture states; the estimate’s 1/P line through its operating point.">
            <PredictionPlot
              measured={measured}
              predictedHzW={result ? result.estimate.linewidthPowerProductHzW : null}
              predictedAt={result ? { outputPowerMw: result.outputPowerMw, linewidthHz: result.estimate.enhancedLinewidthHz } : null}
            />
            {measured.length > 0 && (
              <table className="mt-4 w-full text-sm">
                <thead>
                  <tr className="border-b border-rule text-left text-ink-faint">
                    <th className="py-1.5 pr-3 font-medium">Capture</th>
                    <th className="py-1.5 pr-3 font-medium">Output power</th>
                    <th className="py-1.5 pr-3 font-medium">Measured intrinsic</th>
                    <th className="py-1.5 font-medium">Predicted at this power</th>
                  </tr>
                </thead>
                <tbody>
                  {measured.map((p) => (
                    <tr key={p.id} className="border-b border-rule/60">
                      <td className="py-1.5 pr-3">{p.label}</td>
                      <td className="py-1.5 pr-3">
                        <Quantity q={formatSI(p.outputPowerMw * 1e-3, 'W')} />
                      </td>
                      <td className="py-1.5 pr-3">
                        <Quantity q={formatSI(p.intrinsicLinewidthHz, 'Hz')} />
                      </td>
                      <td className="py-1.5">{result ? <Quantity q={formatSI(result.estimate.linewidthPowerProductHzW / (p.outputPowerMw * 1e-3), 'Hz')} /> : <Mono>—</Mono>}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
            {sweep.withoutParameter > 0 && (
              <p className="mt-3 text-xs text-ink-faint">
                <Mono>{sweep.withoutParameter}</Mono> analysed {sweep.withoutParameter === 1 ? 'capture does' : 'captures do'} not state an output power and {sweep.withoutParameter === 1 ? 'is' : 'are'} not shown.
              </p>
            )}
          </Section>
          <Section id="estimate" title="Estimate">
            {result ? <EstimateFigures estimate={result.estimate} /> : <p className="text-sm text-ink-faint">Give the laser’s parameters and estimate; the figures appear here and on the plot.</p>}
          </Section>
        </div>
      </div>
    </>
  );
}
