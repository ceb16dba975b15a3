/**
 * Exports of a spectrum: the full S_ν series as CSV (from the server), the figures and settings as
 * JSON, and the plot as it is drawn now (view, zoom, band) as SVG or PNG.
 */
import { useState, type RefObject } from 'react';
import type { Analysis } from '../../../../server/contracts/analyses';
import { downloadBlob, downloadText, serializePlotSvg, svgToPng } from '../../../components/plots/plot-export';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-client';
import { getSeriesCsv } from '../api/get-series-csv';
import { figuresDocument } from './result-fields';

export interface ExportMenuProps {
  analysis: Analysis;
  svgRef: RefObject<SVGSVGElement | null>;
  /** file-name stem, e.g. "kestrel-ecl-1550-iq" */
  stem: string;
  /** what the plot shows, for the SVG's title */
  plotTitle: string;
  context: { fileName?: string; laserName?: string | null };
}

type Kind = 'csv' | 'json' | 'svg' | 'png';

export function ExportMenu({ analysis, svgRef, stem, plotTitle, context }: ExportMenuProps) {
  const [busy, setBusy] = useState<Kind | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  async function run(kind: Kind) {
    setBusy(kind);
    setMessage(null);
    try {
      if (kind === 'csv') {
        downloadText(await getSeriesCsv(analysis.id), `${stem}-series.csv`, 'text/csv;charset=utf-8');
      } else if (kind === 'json') {
        downloadText(`${JSON.stringify(figuresDocument(analysis, context), null, 2)}\n`, `${stem}-figures.json`, 'application/json');
      } else {
        const svg = svgRef.current;
        if (!svg) throw new Error('the plot is not drawn yet');
        const text = await serializePlotSvg(svg, { title: plotTitle });
        if (kind === 'svg') downloadText(text, `${stem}-plot.svg`, 'image/svg+xml');
        else downloadBlob(await svgToPng(text, svg.width.baseVal.value, svg.height.baseVal.value, 2), `${stem}-plot.png`);
      }
    } catch (error) {
      setMessage(isApiError(error) ? error.message : `The export failed: ${(error as Error).message ?? 'unknown reason'}.`);
    } finally {
      setBusy(null);
    }
  }

  const item = (kind: Kind, label: string, title: string) => (
    <Button variant="secondary" size="sm" busy={busy === kind} busyLabel={label} onClick={() => void run(kind)} title={title} disabled={busy !== null && busy !== kind}>
      {label}
    </Button>
  );

  return (
    <div className="flex flex-col items-end gap-1.5">
      <div role="group" aria-label="Export" className="flex items-center gap-2">
        <span aria-hidden="true" className="mr-1 text-xs font-medium tracking-[0.08em] text-ink-faint uppercase">
          Export
        </span>
        {item('csv', 'CSV', 'The full S_ν series: frequency_hz, s_nu_hz2_per_hz')}
        {item('json', 'JSON', 'Figures and the settings they came from')}
        {item('svg', 'SVG', 'The plot as drawn now')}
        {item('png', 'PNG', 'The plot as drawn now, at twice the screen resolution')}
      </div>
      {message && (
        <p role="alert" className="text-xs text-danger">
          {message}
        </p>
      )}
    </div>
  );
}
