import { useState } from 'react';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import type { SearchCandidate } from '../api/get-search-run';
import { isAccepted } from '../lib/candidate-elements';
import { derivedForMass } from '../lib/derived-masses';
import { formatQuantity } from '../lib/format-search';

const MAX_PULSAR_MASS_SOLAR = 5; // as the API's assumedPulsarMassSolar rule (api/contracts/search-runs.ts)

/**
 * Mass function, minimum companion mass (solar, Jupiter and Earth masses) and separation of each
 * accepted candidate, for an assumed pulsar mass the user may change (default: the run's).
 * Rejected candidates are left out: they are no discoveries.
 */
export function DerivedMassesTable({ candidates, assumedPulsarMassSolar }: { candidates: SearchCandidate[]; assumedPulsarMassSolar: number }) {
  const [massText, setMassText] = useState(String(assumedPulsarMassSolar));
  const typed = Number(massText);
  const valid = massText.trim() !== '' && Number.isFinite(typed) && typed > 0 && typed <= MAX_PULSAR_MASS_SOLAR;
  const pulsarMass = valid ? typed : assumedPulsarMassSolar;
  const accepted = candidates.filter(isAccepted);
  const rows = accepted.map((c) => ({ candidate: c, derived: derivedForMass(c, pulsarMass) }));
  const recomputed = rows.some((r) => r.derived?.recomputed);
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        <Field
          label="Assumed pulsar mass (M☉)"
          className="w-56"
          error={valid ? undefined : `must be > 0 and ≤ ${MAX_PULSAR_MASS_SOLAR}; showing ${assumedPulsarMassSolar} M☉`}
        >
          {(control) => <Input {...control} inputMode="decimal" value={massText} onChange={(e) => setMassText(e.target.value)} />}
        </Field>
        <p className="pb-2 text-xs text-night-400" aria-live="polite">
          Minimum masses assume an edge-on orbit (sin i = 1) and a pulsar of {pulsarMass} M☉
          {recomputed ? `, recomputed here from the mass function (the search assumed ${assumedPulsarMassSolar} M☉)` : ', as the search assumed'}.
        </p>
      </div>
      {accepted.length === 0 ? (
        <p className="text-sm text-night-300">No accepted companion, so no masses are derived.</p>
      ) : (
        <Table aria-label="Derived masses">
          <THead>
            <tr>
              <Th>Companion</Th>
              <Th>Mass function (M☉)</Th>
              <Th>Minimum mass (M☉)</Th>
              <Th>Minimum mass (Jupiter masses)</Th>
              <Th>Minimum mass (Earth masses)</Th>
              <Th>Separation (au)</Th>
            </tr>
          </THead>
          <TBody>
            {rows.map(({ candidate, derived }) => (
              <Tr key={`${candidate.round}-${candidate.name}`}>
                <Td>
                  <span className="font-mono font-semibold">{candidate.name}</span>
                </Td>
                {derived ? (
                  <>
                    <Td className="font-mono tabular-nums">{formatQuantity(derived.massFunctionSolar)}</Td>
                    <Td className="font-mono tabular-nums">{formatQuantity(derived.minimumMass.solarMasses)}</Td>
                    <Td className="font-mono tabular-nums">{formatQuantity(derived.minimumMass.jupiterMasses)}</Td>
                    <Td className="font-mono tabular-nums">{formatQuantity(derived.minimumMass.earthMasses)}</Td>
                    <Td className="font-mono tabular-nums">{formatQuantity(derived.separationAu)}</Td>
                  </>
                ) : (
                  <Td colSpan={5} className="text-night-300">
                    Not derived for this candidate.
                  </Td>
                )}
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
