/**
 * Short readable list of row numbers for messages: "rows 3, 5, 9 and 12 more".
 */
const MAX_LISTED_ROWS = 10;

export function describeRows(rows: ReadonlyArray<number>): string {
  const listed = rows.slice(0, MAX_LISTED_ROWS).join(', ');
  const rest = rows.length - MAX_LISTED_ROWS;
  return `${rows.length === 1 ? 'row' : 'rows'} ${listed}${rest > 0 ? ` and ${rest} more` : ''}`;
}
