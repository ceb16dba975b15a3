/**
 * A laser's spectra over time: the intrinsic and β-line linewidths of its analysed captures plotted
 * against the date (a click opens that spectrum), and the same points as a table with the operating
 * point of each capture.
 */
import { Link, useNavigate } from 'react-router';
import type { LaserSpectrumPoint } from '../../../../server/contracts/analyses';
import { plotTheme } from '../../../components/plots/plot-theme';
import { TrendPlot } from '../../../components/plots/trend-plot';
import { EmptyNote } from '../../../components/ui/notes';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { paths } from '../../../config/paths';
import { formatIsoDate, formatIsoDateTime } from '../../../lib/dates';
import { formatFixed, formatSI } from '../../../lib/units';
import { useLaserSpectra } from '../api/get-laser-spectra';

const SERIES = [
  { key: 'intrinsic', label: 'intrinsic linewidth', color: plotTheme.trace },
  { key: 'beta', label: 'β-line integrated linewidth', color: plotTheme.beta, dashed: true },
];

function Hz({ value }: { value: number | null }) {
  return value === null ? <span className="text-ink-faint">—</span> : <Quantity q={formatSI(value, 'Hz')} />;
}

function Op({ value, unit, decimals }: { value: number | null; unit: string; decimals: number }) {
  return value === null ? <span className="text-ink-faint">—</span> : <Quantity q={formatFixed(value, unit, decimals, true)} />;
}

export function LaserSpectra({ benchId, laserId, canWrite }: { benchId: string; laserId: string; canWrite: boolean }) {
  const { laser, points } = useLaserSpectra(benchId, laserId);
  const navigate = useNavigate();
  const sorted: LaserSpectrumPoint[] = [...points].sort((a, b) => b.createdAt.localeCompare(a.createdAt));

  if (points.length === 0) {
    return (
      <EmptyNote title={`No analysed spectra of ${laser.name} yet.`}>
        {canWrite
          ? 'Upload a capture with this laser named on it; its linewidths join the trend once the analysis is done.'
          : 'When analysts upload captures of this laser, their linewidths appear here over time.'}
      </EmptyNote>
    );
  }

  return (
    <div className="flex flex-col gap-8" data-testid="laser-spectra">
      <figure>
        <TrendPlot
          label={`Linewidths of ${laser.name} by capture date`}
          series={SERIES}
          points={points.map((p) => ({
            id: p.analysisId,
            date: new Date(p.createdAt),
            values: { intrinsic: p.intrinsicLinewidthHz, beta: p.betaLinewidthHz },
          }))}
          onSelect={(id) => navigate(paths.benches.spectrum.getHref(benchId, id))}
        />
        <figcaption className="mt-2 text-xs text-ink-faint">
          Each point is the latest finished analysis of one capture; choose a point, or a row below, to open its spectrum.
        </figcaption>
      </figure>

      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Analysed captures of {laser.name}, newest first</caption>
        <thead>
          <tr className="border-b border-rule-strong text-xs tracking-[0.06em] text-ink-faint uppercase">
            <th scope="col" className="py-2 pr-4 font-medium">Date</th>
            <th scope="col" className="py-2 pr-4 font-medium">Capture</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">Intrinsic</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">
              <span className="normal-case">β</span>-line
            </th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">FWHM</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">Current</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">Temp.</th>
            <th scope="col" className="py-2 text-right font-medium">Power</th>
          </tr>
        </thead>
        <tbody>
          {sorted.map((p) => (
            <tr key={p.analysisId} className="border-b border-rule hover:bg-paper-card/70">
              <td className="py-2 pr-4">
                <Mono className="text-ink-soft" title={formatIsoDateTime(p.createdAt)}>
                  {formatIsoDate(p.createdAt)}
                </Mono>
              </td>
              <td className="max-w-[14rem] py-2 pr-4">
                <Link to={paths.benches.spectrum.getHref(benchId, p.analysisId)} className="block truncate text-ink underline-offset-4 hover:text-accent hover:underline" title={p.fileName}>
                  {p.fileName}
                </Link>
              </td>
              <td className="py-2 pr-4 text-right">
                <Hz value={p.intrinsicLinewidthHz} />
              </td>
              <td className="py-2 pr-4 text-right">
                <Hz value={p.betaLinewidthHz} />
              </td>
              <td className="py-2 pr-4 text-right">
                <Hz value={p.lineshapeFwhmHz} />
              </td>
              <td className="py-2 pr-4 text-right">
                <Op value={p.driveCurrentMa} unit="mA" decimals={2} />
              </td>
              <td className="py-2 pr-4 text-right">
                <Op value={p.temperatureC} unit="°C" decimals={2} />
              </td>
              <td className="py-2 text-right">
                <Op value={p.outputPowerMw} unit="mW" decimals={3} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
