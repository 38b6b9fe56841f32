import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { formatCount } from '../../../lib/format';

export interface ToaFileProblem {
  line: number | null;
  column: string | null;
  message: string;
}

/** Reads the `details` of a 400 `invalid_toa_file` into rows (unknown shapes become a row with only the message). */
export function toaFileProblemsFrom(rawDetails: readonly Record<string, unknown>[]): ToaFileProblem[] {
  return rawDetails.map((d) => ({
    line: typeof d.line === 'number' ? d.line : null,
    column: typeof d.column === 'string' && d.column !== '' ? d.column : null,
    message: typeof d.message === 'string' ? d.message : String(d.message ?? ''),
  }));
}

/** The total the server counted, from its message ("3 problems; first: …"); null if the message does not say. */
export function totalProblemsFrom(message: string): number | null {
  const match = /^(\d+)\s+problems?\b/.exec(message.trim());
  return match ? Number(match[1]) : null;
}

/** Every listed problem of a rejected TOA file: line, column, message. */
export function ToaFileErrorTable({ problems, total }: { problems: ToaFileProblem[]; total: number | null }) {
  const all = Math.max(total ?? problems.length, problems.length);
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-night-300">
        {all > problems.length
          ? `Showing the first ${formatCount(problems.length)} of ${formatCount(all)} problems.`
          : `${formatCount(problems.length)} ${problems.length === 1 ? 'problem' : 'problems'} in all.`}{' '}
        Nothing of this file was stored.
      </p>
      <Table aria-label="Problems in the file">
        <THead>
          <tr>
            <Th className="w-20">Line</Th>
            <Th className="w-44">Column</Th>
            <Th>Problem</Th>
          </tr>
        </THead>
        <TBody>
          {problems.map((p, index) => (
            <Tr key={index}>
              <Td className="font-mono">{p.line ?? '—'}</Td>
              <Td className="font-mono">{p.column ?? '—'}</Td>
              <Td>{p.message}</Td>
            </Tr>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
