/** How a capture was taken, as a row of facts under a page title: kind, format, rate, setup, operating point, who and when. */
import type { ReactNode } from 'react';
import type { Capture } from '../../../../server/contracts/captures';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { formatIsoDateTime } from '../../../lib/dates';
import { formatFixed, formatSI } from '../../../lib/units';
import { FORMAT_LABELS, KIND_LABELS, SETUP_LABELS } from './capture-labels';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <span className="whitespace-nowrap">
      <span className="text-ink-faint">{term}</span> {children}
    </span>
  );
}

export function CaptureFacts({ capture, laserName }: { capture: Capture; laserName: string | null }) {
  const p = capture.setupParams;
  return (
    <div className="flex flex-col gap-2" data-testid="capture-facts">
      <div className="flex flex-wrap gap-x-6 gap-y-1.5">
        {laserName && <Fact term="laser">{laserName}</Fact>}
        <Fact term="kind">{KIND_LABELS[capture.kind]}</Fact>
        <Fact term="format">{FORMAT_LABELS[capture.format]}</Fact>
        {capture.sampleRateHz !== null && (
          <Fact term="sample rate">
            <Quantity q={formatSI(capture.sampleRateHz, 'Hz', { significant: 4, trim: true })} />
          </Fact>
        )}
        <Fact term="size">
          <Mono>{formatSI(capture.sizeBytes, 'B').text}</Mono>
        </Fact>
        {capture.setup && (
          <Fact term="setup">
            {SETUP_LABELS[capture.setup]}
            {p?.referenceLinewidthHz !== undefined && (
              <>
                , reference <Quantity q={formatSI(p.referenceLinewidthHz, 'Hz')} />
              </>
            )}
            {p?.delayS !== undefined && (
              <>
                , delay <Quantity q={formatSI(p.delayS, 's')} />
              </>
            )}
          </Fact>
        )}
      </div>
      <div className="flex flex-wrap gap-x-6 gap-y-1.5">
        {capture.driveCurrentMa !== null && (
          <Fact term="drive current">
            <Quantity q={formatFixed(capture.driveCurrentMa, 'mA', 2, true)} />
          </Fact>
        )}
        {capture.temperatureC !== null && (
          <Fact term="temperature">
            <Quantity q={formatFixed(capture.temperatureC, '°C', 2, true)} />
          </Fact>
        )}
        {capture.outputPowerMw !== null && (
          <Fact term="output power">
            <Quantity q={formatFixed(capture.outputPowerMw, 'mW', 3, true)} />
          </Fact>
        )}
        <Fact term="uploaded">
          <Mono>{formatIsoDateTime(capture.createdAt)}</Mono>
          {capture.uploadedByName && <> by {capture.uploadedByName}</>}
        </Fact>
        {capture.tags.length > 0 && (
          <Fact term="tags">
            {capture.tags.map((t) => (
              <span key={t} className="mr-1 rounded-full border border-rule px-1.5 text-xs text-ink-soft">
                {t}
              </span>
            ))}
          </Fact>
        )}
      </div>
      {capture.notes && <p className="max-w-[44rem] text-sm leading-relaxed whitespace-pre-line text-ink-soft">{capture.notes}</p>}
      {capture.duplicateOf && <p className="text-xs text-caution">The same bytes were uploaded to this bench before.</p>}
    </div>
  );
}
