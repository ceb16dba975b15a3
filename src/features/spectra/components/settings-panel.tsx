/**
 * The settings a spectrum came from, as the engine resolved them, and a form to run the capture's
 * analysis again with others (window, segment, overlap, observation time; the white-floor band
 * kept or found again). A new analysis is kept beside this one; the page moves to it.
 */
import { useState, type FormEvent, type ReactNode } from 'react';
import { AnalysisSettings, WindowName, type AnalysisSettings as Settings } from '../../../../server/contracts/analyses';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormAlert } from '../../../components/ui/notes';
import { Mono } from '../../../components/ui/quantity';
import { validateWith } from '../../../lib/form';
import { formatFixed, formatSI } from '../../../lib/units';
import type { ReadResult } from './result-fields';

const WINDOW_LABELS: Record<WindowName, string> = {
  hann: 'Hann',
  'blackman-harris': 'Blackman–Harris, 4 terms',
  'flat-top': 'Flat-top',
};

export interface SettingsPanelProps {
  r: ReadResult;
  /** the settings the analysis was asked for (what was left out took the engine's default) */
  requested: Settings;
  canWrite: boolean;
  running: boolean;
  error: string | null;
  onRun: (settings: Settings) => void;
}

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-b border-rule/70 py-1 text-sm last:border-b-0">
      <dt className="text-ink-faint">{term}</dt>
      <dd className="text-right text-ink">{children}</dd>
    </div>
  );
}

export function SettingsPanel({ r, requested, canWrite, running, error, onRun }: SettingsPanelProps) {
  const [window, setWindow] = useState<string>(r.settings.window);
  const [segment, setSegment] = useState(String(r.settings.segment));
  const [overlap, setOverlap] = useState(String(r.settings.overlap));
  const [t0Ms, setT0Ms] = useState(formatFixed(r.beta.observationTimeS * 1000, '', 6, true).number);
  const [keepBand, setKeepBand] = useState(Boolean(requested.floorBandHz));
  const [errors, setErrors] = useState<Record<string, string | undefined>>({});

  const s = r.settings;
  const rbw = s.enbwHz;

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const values: Record<string, unknown> = {
      window,
      segment: Number(segment.trim()),
      overlap: Number(overlap.trim().replace(',', '.')),
      observationTimeS: Number(t0Ms.trim().replace(',', '.')) / 1000,
    };
    if (keepBand && requested.floorBandHz) values.floorBandHz = requested.floorBandHz;
    const checked = validateWith(AnalysisSettings, values);
    if (!checked.ok) {
      setErrors({ ...checked.fieldErrors, t0: checked.fieldErrors.observationTimeS });
      return;
    }
    setErrors({});
    onRun(checked.data);
  }

  return (
    <div data-testid="settings-panel">
      <dl>
        <Fact term="window">{WINDOW_LABELS[s.window as WindowName] ?? s.window}</Fact>
        <Fact term="segment">
          <Mono>{s.segment.toLocaleString('en-GB')}</Mono> samples
        </Fact>
        <Fact term="overlap">
          <Mono>{formatFixed(s.overlap * 100, '%', 1, true).text}</Mono>
        </Fact>
        <Fact term="averages">
          <Mono>{s.averages.toLocaleString('en-GB')}</Mono>
          {s.equivalentAverages !== null && (
            <span className="text-ink-faint">
              {' '}
              (K<sub>eff</sub> <Mono>{formatFixed(s.equivalentAverages, '', 1, true).number}</Mono>)
            </span>
          )}
        </Fact>
        {rbw !== null && (
          <Fact term="RBW (ENBW)">
            <Mono>{formatSI(rbw, 'Hz').text}</Mono>
          </Fact>
        )}
        <Fact term="sample rate">
          <Mono>{formatSI(r.input.sampleRateHz, 'Hz', { significant: 4, trim: true }).text}</Mono>
        </Fact>
        <Fact term="record">
          <Mono>{r.input.samples.toLocaleString('en-GB')}</Mono> samples · <Mono>{formatSI(r.input.durationS, 's').text}</Mono>
        </Fact>
      </dl>

      {canWrite ? (
        <form onSubmit={onSubmit} noValidate className="mt-6 flex flex-col gap-4 border-t border-rule pt-5" aria-label="Run the analysis again">
          <p className="text-sm font-medium text-ink">Run again with other settings</p>
          <SelectField label="Window" name="window" value={window} onChange={(e) => setWindow(e.currentTarget.value)} options={WindowName.options.map((w) => ({ value: w, label: WINDOW_LABELS[w] }))} error={errors.window} />
          <TextField label="Segment" unit="samples" name="segment" inputMode="numeric" value={segment} onChange={(e) => setSegment(e.currentTarget.value)} error={errors.segment} />
          <TextField label="Overlap" name="overlap" inputMode="decimal" hint="Fraction of a segment, 0 to below 1." value={overlap} onChange={(e) => setOverlap(e.currentTarget.value)} error={errors.overlap} />
          <TextField label="Observation time T₀" unit="ms" name="observationTimeMs" inputMode="decimal" value={t0Ms} onChange={(e) => setT0Ms(e.currentTarget.value)} error={errors.t0} />
          {requested.floorBandHz && (
            <label className="flex items-start gap-2 text-sm text-ink-soft">
              <input type="checkbox" className="mt-1 accent-[#0b5f8a]" checked={keepBand} onChange={(e) => setKeepBand(e.currentTarget.checked)} />
              <span>
                Keep the white-floor band <Mono>{formatSI(requested.floorBandHz[0], 'Hz').text} – {formatSI(requested.floorBandHz[1], 'Hz').text}</Mono>
                <span className="block text-xs text-ink-faint">Unticked, the engine finds the flattest band again.</span>
              </span>
            </label>
          )}
          <div>
            <Button type="submit" variant="primary" size="sm" busy={running} busyLabel="Queuing…">
              Run a new analysis
            </Button>
          </div>
          <p className="text-xs text-ink-faint">The new analysis is kept beside this one; this page moves to it.</p>
          <FormAlert message={error} />
        </form>
      ) : (
        <p className="mt-5 text-xs text-ink-faint">Analysts and owners can run the analysis again with other settings.</p>
      )}
    </div>
  );
}
