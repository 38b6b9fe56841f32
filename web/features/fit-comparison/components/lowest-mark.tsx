/** "lowest" with a downward marker: the run a criterion prefers, marked by text and shape, not colour alone. */
export function LowestMark({ criterion }: { criterion: string }) {
  return (
    <span className="ml-2 inline-flex items-center gap-1 rounded-full border border-calm-500/70 px-2 text-xs font-medium text-calm-400">
      <svg aria-hidden="true" viewBox="0 0 10 10" className="size-2.5" fill="currentColor">
        <path d="M1 2h8L5 9z" />
      </svg>
      lowest {criterion}
    </span>
  );
}
