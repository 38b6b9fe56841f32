import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { cn } from '../../../lib/cn';
import { formatUncertainty } from '../../fit-runs/lib/format-fit';
import type { SearchCandidate } from '../api/get-search-run';
import type { SearchCandidateStatus } from '../../../../api/contracts/search-runs';
import { ELEMENT_SPECS, isAccepted } from '../lib/candidate-elements';
import { formatChi2Change, formatFap, formatPeriodDays } from '../lib/format-search';

const VERDICT_TEXT: Record<SearchCandidateStatus, { mark: string; label: string; className: string }> = {
  accepted: { mark: '✓', label: 'accepted', className: 'border-calm-500/70 text-calm-400' },
  unstable: { mark: '✗', label: 'unstable — not a discovery', className: 'border-alarm-500/70 text-alarm-300' },
  degenerate: { mark: '✗', label: 'degenerate — not a discovery', className: 'border-alarm-500/70 text-alarm-300' },
};

/** A candidate's verdict as a mark and words in an outlined badge (the words carry the meaning). */
export function CandidateVerdictBadge({ candidate }: { candidate: Pick<SearchCandidate, 'status'> }) {
  const verdict = VERDICT_TEXT[candidate.status];
  return (
    <span className={cn('inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-medium', verdict.className)}>
      <span aria-hidden="true">{verdict.mark}</span>
      {verdict.label}
    </span>
  );
}

/** χ² before → after adding the candidate; the orbit fit may have failed (after = null). */
function chi2Text(c: Pick<SearchCandidate, 'chi2Before' | 'chi2After'>): string {
  return `χ² ${c.chi2Before.toFixed(1)} → ${c.chi2After === null ? 'no value (the orbit fit failed)' : c.chi2After.toFixed(1)}`;
}

/** The eccentricity F-test in words. */
function eccentricityText(test: SearchCandidate['eccentricityTest']): string {
  if (!test.attempted) return 'Circular orbit kept (the eccentric fit could not be done).';
  const f = `F = ${test.statistic.toPrecision(3)}, probability ${formatFap(test.probability)}`;
  return test.kept
    ? `Eccentricity and periastron longitude fitted: the F-test favoured an eccentric orbit (${f}).`
    : `Circular orbit kept: the F-test did not favour an eccentric orbit (${f}).`;
}

function ElementCell({ candidate, elementKey }: { candidate: SearchCandidate; elementKey: string }) {
  const element = candidate.elements[elementKey];
  if (!element) {
    const fixed = elementKey === 'eccentricity' || elementKey === 'periastron_longitude_deg';
    return <span className="text-xs text-night-400">{fixed ? 'not fitted (circular orbit kept)' : 'not reported'}</span>;
  }
  return (
    <span className="whitespace-nowrap font-mono tabular-nums">
      {element.value}
      {element.uncertainty === null ? null : ` ± ${formatUncertainty(element.uncertainty)}`}
      {element.unit ? <span className="ml-1 text-night-400">{element.unit}</span> : null}
      {element.uncertainty === null ? <span className="ml-1 font-sans text-xs text-night-400">(held fixed)</span> : null}
    </span>
  );
}

/**
 * Every candidate of a search, one row each: verdict (rejected ones say why and are marked as no
 * discovery), the five Keplerian elements ± 1σ, the FAP of the peak that seeded it and the χ²
 * change of adding it. Elements beyond the five, when the engine fitted any, follow in a list.
 */
export function CandidatesTable({ candidates }: { candidates: SearchCandidate[] }) {
  const extraKeys = (c: SearchCandidate) => Object.keys(c.elements).filter((k) => !ELEMENT_SPECS.some((s) => s.key === k));
  return (
    <div className="flex flex-col gap-3">
      <Table aria-label="Companion candidates">
        <THead>
          <tr>
            <Th>Companion</Th>
            <Th>Status</Th>
            {ELEMENT_SPECS.map((spec) => (
              <Th key={spec.key}>
                <span className="whitespace-nowrap">
                  {spec.label} ± 1<span className="normal-case">σ</span>
                </span>
              </Th>
            ))}
            <Th>FAP at discovery</Th>
            <Th>
              <span className="normal-case">Δχ²</span>
            </Th>
          </tr>
        </THead>
        <TBody>
          {candidates.map((c) => (
            <Tr key={`${c.round}-${c.name}`} className={isAccepted(c) ? undefined : 'bg-alarm-500/5 text-night-300'}>
              <Td>
                <span className="font-mono font-semibold">{c.name}</span>
                <span className="ml-2 text-xs text-night-400">round {c.round}</span>
              </Td>
              <Td>
                <CandidateVerdictBadge candidate={c} />
                {c.reason ? <p className="mt-1 max-w-56 text-xs text-night-300">{c.reason}</p> : null}
                {c.converged ? null : <p className="mt-1 text-xs font-medium text-alarm-300">⚠ its fit did not converge</p>}
              </Td>
              {ELEMENT_SPECS.map((spec) => (
                <Td key={spec.key}>
                  <ElementCell candidate={c} elementKey={spec.key} />
                </Td>
              ))}
              <Td>
                <span className="font-mono tabular-nums">{formatFap(c.falseAlarmProbability)}</span>
              </Td>
              <Td>
                <span className="whitespace-nowrap font-mono tabular-nums" title={chi2Text(c)}>
                  {formatChi2Change(c.chi2Change)}
                </span>
              </Td>
            </Tr>
          ))}
        </TBody>
      </Table>
      <ul className="flex flex-col gap-1 text-xs text-night-400">
        {candidates.map((c) => (
          <li key={`${c.round}-${c.name}-notes`}>
            <span className="font-mono text-night-200">{c.name}</span>:{' '}
            {eccentricityText(c.eccentricityTest)}{' '}
            Seeded at {formatPeriodDays(c.seedPeriodDays)}.
            {chi2Text(c)}.
            {extraKeys(c).map((key) => (
              <span key={key} className="ml-2">
                {key}: <ElementCell candidate={c} elementKey={key} />
              </span>
            ))}
          </li>
        ))}
      </ul>
    </div>
  );
}
