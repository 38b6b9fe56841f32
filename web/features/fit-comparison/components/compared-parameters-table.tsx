import type { ComparedParameter, ComparedValue, FitComparison } from '../../../../api/contracts/comparisons';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { cn } from '../../../lib/cn';
import { formatSigma, formatUncertainty } from '../../fit-runs/lib/format-fit';
import { isLargeDifference, LARGE_DIFFERENCE_SIGMA } from '../lib/comparison-format';

function DifferenceLine({ value, unit }: { value: ComparedValue; unit: string }) {
  if (value.differenceSigma !== null) {
    const large = isLargeDifference(value.differenceSigma);
    return (
      <span className={cn('mt-0.5 block text-xs tabular-nums', large ? 'font-semibold text-ember-300' : 'text-night-300')}>
        {large ? <span aria-hidden="true">▲ </span> : null}
        {formatSigma(value.differenceSigma)} vs reference
        {large ? <span className="ml-1 font-normal">(more than {LARGE_DIFFERENCE_SIGMA}σ)</span> : null}
      </span>
    );
  }
  if (value.difference !== null && value.difference !== 0) {
    // Both runs held it fixed (σ = 0 on both sides): the plain difference is all there is.
    return (
      <span className="mt-0.5 block text-xs text-night-300">
        differs by {value.difference.toPrecision(3)} {unit}, both held fixed
      </span>
    );
  }
  return null;
}

function ValueCell({ value, unit, isReference }: { value: ComparedValue | null; unit: string; isReference: boolean }) {
  if (value === null) return <Td className="text-xs text-night-400">not in this model</Td>;
  const large = !isReference && isLargeDifference(value.differenceSigma);
  return (
    <Td className={cn('align-top', large && 'bg-ember-500/10')}>
      <span className="font-mono text-xs tabular-nums">
        {value.value}
        {value.uncertainty !== null ? ` ± ${formatUncertainty(value.uncertainty)}` : null}
      </span>
      {unit ? <span className="ml-1 text-xs text-night-400">{unit}</span> : null}
      {!value.free ? <span className="ml-1 text-xs text-night-400">(held fixed)</span> : null}
      {isReference ? null : <DifferenceLine value={value} unit={unit} />}
    </Td>
  );
}

function ParameterRow({ parameter }: { parameter: ComparedParameter }) {
  return (
    <Tr>
      <Th scope="row" className="align-top font-mono text-xs font-normal text-night-100">
        {parameter.path}
      </Th>
      {parameter.values.map((value, i) => (
        <ValueCell key={i} value={value} unit={parameter.unit} isReference={i === 0} />
      ))}
    </Tr>
  );
}

/**
 * Every fitted parameter (value ± 1σ) per run, reference first; under each other run's value its
 * difference to the reference in units of the combined uncertainty, marked by a symbol and words
 * (not only colour) beyond 3σ.
 */
export function ComparedParametersTable({ comparison }: { comparison: FitComparison }) {
  return (
    <Table aria-label="Parameters of the compared runs">
      <THead>
        <tr>
          <Th scope="col">Parameter</Th>
          {comparison.runs.map((run, i) => (
            <Th key={run.fitRunId} scope="col">
              <span className="normal-case tracking-normal">
                Run #{run.fitRunId}
                {i === 0 ? ' (reference)' : ''}
              </span>
            </Th>
          ))}
        </tr>
      </THead>
      <TBody>
        {comparison.parameters.map((p) => (
          <ParameterRow key={p.path} parameter={p} />
        ))}
      </TBody>
    </Table>
  );
}
