import { useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { describeError } from '../../../components/query-state';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { useDeleteObservatory } from '../api/delete-observatory';
import type { Observatory } from '../api/get-observatories';
import { geocentricDistanceKm } from '../observatory-rules';

const metresFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 3 });

function DeleteControl({ code }: { code: string }) {
  const [confirming, setConfirming] = useState(false);
  const remove = useDeleteObservatory();
  if (!confirming) {
    return (
      <Button variant="ghost" size="sm" onClick={() => setConfirming(true)} aria-label={`Delete ${code}`}>
        Delete
      </Button>
    );
  }
  return (
    <span className="inline-flex items-center gap-2">
      <span className="text-xs text-night-300">Delete {code}?</span>
      <Button variant="danger" size="sm" busy={remove.isPending} onClick={() => remove.mutate(code)}>
        Yes, delete
      </Button>
      <Button variant="ghost" size="sm" onClick={() => setConfirming(false)}>
        Keep
      </Button>
      {remove.isError ? <span role="alert" className="text-xs text-alarm-300">{describeError(remove.error)}</span> : null}
    </span>
  );
}

/** The observatory list; `onEdit` (admins only) adds Edit and Delete controls to every row. */
export function ObservatoryTable({ observatories, onEdit }: { observatories: Observatory[]; onEdit?: (o: Observatory) => void }) {
  return (
    <>
      <Table aria-label="Observatories">
        <THead>
          <tr>
            <Th>Code</Th>
            <Th>Name</Th>
            <Th className="text-right">ITRF x (m)</Th>
            <Th className="text-right">ITRF y (m)</Th>
            <Th className="text-right">ITRF z (m)</Th>
            <Th className="text-right">From geocentre</Th>
            <Th className="text-right">Clock points</Th>
            {onEdit ? <Th><span className="sr-only">Actions</span></Th> : null}
          </tr>
        </THead>
        <TBody>
          {observatories.map((o) => (
            <Tr key={o.code}>
              <Td className="font-mono text-ember-300">{o.code}</Td>
              <Td>{o.name}</Td>
              <Td className="text-right font-mono tabular-nums">{metresFormat.format(o.itrf_x_m)}</Td>
              <Td className="text-right font-mono tabular-nums">{metresFormat.format(o.itrf_y_m)}</Td>
              <Td className="text-right font-mono tabular-nums">{metresFormat.format(o.itrf_z_m)}</Td>
              <Td className="text-right font-mono tabular-nums text-night-300">
                {geocentricDistanceKm(o.itrf_x_m, o.itrf_y_m, o.itrf_z_m).toFixed(1)} km
              </Td>
              <Td className="text-right font-mono">{o.clock_corrections?.length ?? 0}</Td>
              {onEdit ? (
                <Td className="whitespace-nowrap text-right">
                  <Button variant="ghost" size="sm" onClick={() => onEdit(o)} aria-label={`Edit ${o.code}`}>
                    Edit
                  </Button>
                  <DeleteControl code={o.code} />
                </Td>
              ) : null}
            </Tr>
          ))}
        </TBody>
      </Table>
      {observatories.length === 0 ? <Alert className="mt-4">No observatories are registered yet.</Alert> : null}
    </>
  );
}
