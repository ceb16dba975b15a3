/** The bench's RF beat spectra: name, mode, best shape and its FWHM, date. */
import { Link } from 'react-router';
import type { RfSpectrumSummary } from '../../../../server/contracts/rf-spectra';
import { EmptyNote } from '../../../components/ui/notes';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { paths } from '../../../config/paths';
import { formatIsoDate } from '../../../lib/dates';
import { formatSI } from '../../../lib/units';

const SHAPE_LABEL = { lorentzian: 'Lorentzian', gaussian: 'Gaussian', voigt: 'Voigt' } as const;

export function RfSpectrumList({ benchId, spectra }: { benchId: string; spectra: RfSpectrumSummary[] }) {
  if (spectra.length === 0) {
    return <EmptyNote title="No RF spectra on this bench yet.">Upload a spectrum-analyser trace to fit its line.</EmptyNote>;
  }
  return (
    <table className="w-full border-collapse text-[0.9375rem]" data-testid="rf-spectrum-list">
      <thead>
        <tr className="border-b border-rule-strong text-left text-xs tracking-wide text-ink-faint uppercase">
          <th scope="col" className="py-2 pr-4 font-medium">Name</th>
          <th scope="col" className="py-2 pr-4 font-medium">Measurement</th>
          <th scope="col" className="py-2 pr-4 font-medium">Best fit</th>
          <th scope="col" className="py-2 pr-4 font-medium">Points</th>
          <th scope="col" className="py-2 font-medium">Uploaded</th>
        </tr>
      </thead>
      <tbody>
        {spectra.map((s) => (
          <tr key={s.id} className="border-b border-rule">
            <td className="py-2 pr-4">
              <Link to={paths.benches.rfSpectrum.getHref(benchId, s.id)} className="font-medium text-ink underline-offset-4 hover:text-accent hover:underline">
                {s.name}
              </Link>
            </td>
            <td className="py-2 pr-4">{s.mode === 'beat' ? 'beat' : 'self-heterodyne'}</td>
            <td className="py-2 pr-4">
              {SHAPE_LABEL[s.bestShape]} <Quantity q={formatSI(s.bestFwhmHz, 'Hz', { significant: 4 })} />
            </td>
            <td className="py-2 pr-4">
              <Mono>{s.points}</Mono>
            </td>
            <td className="py-2">
              <Mono>{formatIsoDate(s.createdAt)}</Mono>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
