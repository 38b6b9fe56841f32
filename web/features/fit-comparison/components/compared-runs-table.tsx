import type { ReactNode } from 'react';
import type { ComparedRun, FitComparison } from '../../../../api/contracts/comparisons';
import { Button } from '../../../components/button';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { formatCount, formatDateTimeUtc } from '../../../lib/format';
import { formatReducedChi2, formatRmsUs } from '../../fit-runs/lib/format-fit';
import { formatCriterion, formatCriterionDelta, lowestIndices } from '../lib/comparison-format';
import { LowestMark } from './lowest-mark';
import { RunHeading } from './run-heading';

function CriterionCells({ runs, pick, criterion, comparable }: { runs: ComparedRun[]; pick: (r: ComparedRun) => number; criterion: string; comparable: boolean }) {
  const values = runs.map(pick);
  const lowest = comparable ? lowestIndices(values) : [];
  const lowestValue = lowest.length > 0 ? values[lowest[0]] : NaN;
  return (
    <>
      {runs.map((run, i) => (
        <Td key={run.fitRunId} className="font-mono tabular-nums">
          {formatCriterion(values[i])}
          {lowest.includes(i) ? (
            <LowestMark criterion={criterion} />
          ) : comparable ? (
            <span className="ml-2 text-xs text-night-400">Δ {formatCriterionDelta(values[i], lowestValue)}</span>
          ) : null}
        </Td>
      ))}
    </>
  );
}

function Row({ label, children }: { label: ReactNode; children: ReactNode }) {
  return (
    <Tr>
      <Th scope="row" className="whitespace-nowrap text-night-300">
        {label}
      </Th>
      {children}
    </Tr>
  );
}

/**
 * The runs side by side: revision, TOAs, χ², dof, χ²/dof, weighted RMS, free parameters, AIC and BIC
 * (the lowest marked in words when the statistics are comparable, the others as Δ to it), convergence.
 * `onMakeReference` adds a "Use as reference" button to every other run's column.
 */
export function ComparedRunsTable({ comparison, onMakeReference }: { comparison: FitComparison; onMakeReference?: (fitRunId: number) => void }) {
  const { runs, statisticsComparable } = comparison;
  const cells = (render: (run: ComparedRun) => ReactNode, className = 'font-mono tabular-nums') =>
    runs.map((run) => (
      <Td key={run.fitRunId} className={className}>
        {render(run)}
      </Td>
    ));
  return (
    <Table aria-label="Fit statistics of the compared runs">
      <THead>
        <tr>
          <Th scope="col">Run</Th>
          {runs.map((run, i) => (
            <Th key={run.fitRunId} scope="col" className="align-top">
              <RunHeading run={run} isReference={i === 0} />
              {i > 0 && onMakeReference ? (
                <Button variant="ghost" size="sm" className="mt-1 h-7 px-2 text-xs normal-case tracking-normal" onClick={() => onMakeReference(run.fitRunId)}>
                  Use run #{run.fitRunId} as reference
                </Button>
              ) : null}
            </Th>
          ))}
        </tr>
      </THead>
      <TBody>
        <Row label="Finished">{cells((r) => (r.finishedAt ? formatDateTimeUtc(r.finishedAt) : '—'), 'text-xs')}</Row>
        <Row label="TOAs fitted">
          {cells((r) => (
            <>
              {formatCount(r.toaCount)}
              {r.excludedCount > 0 ? <span className="ml-1 text-xs text-night-400">({formatCount(r.excludedCount)} excluded)</span> : null}
            </>
          ))}
        </Row>
        <Row label="χ²">{cells((r) => formatCriterion(r.chi2))}</Row>
        <Row label="Degrees of freedom">{cells((r) => formatCount(r.dof))}</Row>
        <Row label="χ²/dof">{cells((r) => formatReducedChi2(r.reducedChi2))}</Row>
        <Row label="Weighted RMS">{cells((r) => formatRmsUs(r.weightedRmsUs))}</Row>
        <Row label="Free parameters">
          {cells((r) => (
            <span title={r.freeParameters.paths.join(', ')}>{formatCount(r.freeParameters.count)}</span>
          ))}
        </Row>
        <Row label={<abbr title="Akaike information criterion, χ² + 2k (Akaike 1974)">AIC</abbr>}>
          <CriterionCells runs={runs} pick={(r) => r.aic} criterion="AIC" comparable={statisticsComparable} />
        </Row>
        <Row label={<abbr title="Bayesian information criterion, χ² + k ln N (Schwarz 1978)">BIC</abbr>}>
          <CriterionCells runs={runs} pick={(r) => r.bic} criterion="BIC" comparable={statisticsComparable} />
        </Row>
        <Row label="Converged">
          {cells((r) =>
            r.converged ? (
              'yes'
            ) : (
              <span className="font-semibold text-alarm-300">
                <span aria-hidden="true">⚠ </span>no
              </span>
            ),
          )}
        </Row>
      </TBody>
    </Table>
  );
}
