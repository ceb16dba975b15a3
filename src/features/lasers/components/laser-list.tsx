import { useState } from 'react';
import type { Laser } from '../../../../server/contracts/lasers';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Mono, Quantity } from '../../../components/ui/quantity';
import { formatIsoDate, formatIsoDateTime } from '../../../lib/dates';
import { formatFrequencyThz, formatWavelengthNm } from '../../../lib/units';
import { useDeleteLaser } from '../api/delete-laser';
import { LaserForm } from './laser-form';
import { LASER_TYPE_LABELS } from './laser-type-labels';

export interface LaserListProps {
  benchId: string;
  lasers: Laser[];
  /** owners and analysts edit and remove lasers */
  canWrite: boolean;
  onChanged?: () => void;
}

/** The lasers on a bench as a ruled table; numbers and units in JetBrains Mono. */
export function LaserList({ benchId, lasers, canWrite, onChanged }: LaserListProps) {
  const [editingId, setEditingId] = useState<string | null>(null);
  const [removing, setRemoving] = useState<Laser | null>(null);
  const deleteLaser = useDeleteLaser(benchId, { onChanged });
  const columns = canWrite ? 6 : 5;
  const sorted = [...lasers].sort((a, b) => a.name.localeCompare(b.name));

  return (
    <>
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Lasers on this bench</caption>
        <thead>
          <tr className="border-b border-rule-strong text-xs tracking-[0.06em] text-ink-faint uppercase">
            <th scope="col" className="py-2 pr-4 font-medium">Laser</th>
            <th scope="col" className="py-2 pr-4 font-medium">Type</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">Wavelength</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">Frequency</th>
            <th scope="col" className="py-2 pr-4 text-right font-medium">Updated</th>
            {canWrite && (
              <th scope="col" className="py-2 text-right font-medium">
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {sorted.map((laser) =>
            editingId === laser.id ? (
              <tr key={laser.id} className="border-b border-rule bg-paper-card">
                <td colSpan={columns} className="px-5 pt-4 pb-6">
                  <p className="mb-4 text-sm font-medium text-ink">Editing {laser.name}</p>
                  <LaserForm
                    benchId={benchId}
                    laser={laser}
                    onChanged={onChanged}
                    onDone={() => setEditingId(null)}
                    onCancel={() => setEditingId(null)}
                  />
                </td>
              </tr>
            ) : (
              <tr key={laser.id} className="border-b border-rule align-top" data-laser-id={laser.id}>
                <td className="py-3.5 pr-4">
                  <span className="font-medium text-ink">{laser.name}</span>
                  {laser.notes && <p className="mt-0.5 line-clamp-2 max-w-[26rem] text-sm leading-relaxed text-ink-soft">{laser.notes}</p>}
                </td>
                <td className="py-3.5 pr-4 text-sm whitespace-nowrap text-ink-soft">{LASER_TYPE_LABELS[laser.type]}</td>
                <td className="py-3.5 pr-4 text-right">
                  <Quantity q={formatWavelengthNm(laser.wavelengthNm)} className="text-[0.9375rem]" />
                </td>
                <td className="py-3.5 pr-4 text-right">
                  <Quantity
                    q={formatFrequencyThz(laser.frequencyThz)}
                    className="text-[0.9375rem]"
                    title={laser.frequencyThz != null ? `${laser.frequencyThz} THz` : undefined}
                  />
                </td>
                <td className="py-3.5 pr-4 text-right">
                  <Mono className="text-sm whitespace-nowrap text-ink-faint" title={formatIsoDateTime(laser.updatedAt)}>
                    {formatIsoDate(laser.updatedAt)}
                  </Mono>
                </td>
                {canWrite && (
                  <td className="py-2.5 text-right whitespace-nowrap">
                    <Button variant="quiet" size="sm" onClick={() => setEditingId(laser.id)} aria-label={`Edit ${laser.name}`}>
                      Edit
                    </Button>
                    <Button
                      variant="quiet"
                      size="sm"
                      className="ml-4 text-danger hover:text-danger"
                      onClick={() => setRemoving(laser)}
                      aria-label={`Remove ${laser.name}`}
                    >
                      Remove
                    </Button>
                  </td>
                )}
              </tr>
            ),
          )}
        </tbody>
      </table>
      <ConfirmDialog
        open={removing !== null}
        title={removing ? `Remove ${removing.name}?` : 'Remove laser?'}
        confirmLabel="Remove laser"
        busy={deleteLaser.isPending}
        error={deleteLaser.error?.message}
        onConfirm={() => {
          if (removing) deleteLaser.mutate(removing.id, { onSuccess: () => setRemoving(null) });
        }}
        onClose={() => {
          setRemoving(null);
          deleteLaser.reset();
        }}
      >
        The laser leaves this bench for every member. This cannot be undone.
      </ConfirmDialog>
    </>
  );
}
