import { cn } from '../../../lib/cn';
import type { ToaGroup } from '../lib/explorer-groups';

// Unicode stand-ins for the plot's marker shapes, so the buttons carry the symbol as well as the colour.
const SYMBOL_GLYPHS: Record<string, string> = {
  circle: '●', square: '■', diamond: '◆', 'triangle-up': '▲', 'triangle-down': '▼', star: '★', hexagon: '⬢',
  'circle-open': '○', 'square-open': '□', 'diamond-open': '◇', 'triangle-up-open': '△', x: '✕',
};

/**
 * The plot's groups as toggle buttons (the keyboard way to do what a legend click does):
 * pressed = drawn. At least one group always stays drawn.
 */
export function GroupToggles({ groups, hidden, onHiddenChange }: { groups: readonly ToaGroup[]; hidden: ReadonlySet<string>; onHiddenChange(hidden: Set<string>): void }) {
  return (
    <div role="group" aria-label="Groups drawn" className="flex flex-wrap items-center gap-2">
      <span className="text-xs text-night-400">Draw:</span>
      {groups.map((g) => {
        const shown = !hidden.has(g.name);
        const lastShown = shown && groups.every((o) => o === g || hidden.has(o.name));
        return (
          <button
            key={g.name}
            type="button"
            aria-pressed={shown}
            disabled={lastShown}
            onClick={() => {
              const next = new Set(hidden);
              if (shown) next.add(g.name);
              else next.delete(g.name);
              onHiddenChange(next);
            }}
            className={cn(
              'inline-flex h-7 items-center gap-1.5 rounded-full border px-2.5 text-xs focus-ring disabled:cursor-not-allowed',
              shown ? 'border-night-500 bg-night-800 text-night-100' : 'border-night-700 text-night-400 line-through',
            )}
          >
            <span aria-hidden="true" style={{ color: g.style.colour }}>
              {SYMBOL_GLYPHS[g.style.symbol] ?? '●'}
            </span>
            {g.name} ({g.indices.length})
          </button>
        );
      })}
    </div>
  );
}
