import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { formatUncertainty } from '../../fit-runs/lib/format-fit';
import type { SearchResult } from '../api/get-search-run';

/** Every fitted parameter of the resulting model (by solve_for path) with its value ± 1σ. */
export function FinalFitParameters({ parameters }: { parameters: SearchResult['finalFit']['parameters'] }) {
  const entries = Object.entries(parameters);
  if (entries.length === 0) return <p className="text-sm text-night-300">The final fit solved for no parameter.</p>;
  return (
    <Table aria-label="Final fit parameters">
      <THead>
        <tr>
          <Th>Parameter</Th>
          <Th>
            <span className="whitespace-nowrap">
              Value ± 1<span className="normal-case">σ</span>
            </span>
          </Th>
        </tr>
      </THead>
      <TBody>
        {entries.map(([path, p]) => (
          <Tr key={path}>
            <Td className="font-mono text-night-100">{path}</Td>
            <Td className="font-mono tabular-nums">
              {p.value}
              {p.uncertainty === null ? ' (held fixed)' : ` ± ${formatUncertainty(p.uncertainty)}`}
              {p.unit ? <span className="ml-1 text-night-400">{p.unit}</span> : null}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
