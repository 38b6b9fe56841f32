/**
 * Marker colour and symbol per backend. Every backend differs in BOTH, so the plot reads without
 * colour vision. Colours: the Okabe–Ito set (Okabe & Ito 2008, "Color Universal Design"),
 * reordered so the first ones stand out on the app's dark night background; its black is left
 * out because it vanishes there.
 */
export const BACKEND_COLOURS = ['#56B4E9', '#E69F00', '#009E73', '#F0E442', '#CC79A7', '#D55E00', '#0072B2'] as const;

// Filled shapes first, outlines after, so the first seven backends never share a symbol.
export const BACKEND_SYMBOLS = [
  'circle',
  'square',
  'diamond',
  'triangle-up',
  'triangle-down',
  'star',
  'hexagon',
  'circle-open',
  'square-open',
  'diamond-open',
  'triangle-up-open',
  'x',
] as const;

export interface BackendStyle {
  colour: string;
  symbol: string;
}

/**
 * The style of the `index`-th backend (in sorted name order). Colours repeat after 7 and symbols
 * after 12; the pair only repeats after 84 backends.
 */
export function backendStyle(index: number): BackendStyle {
  return { colour: BACKEND_COLOURS[index % BACKEND_COLOURS.length], symbol: BACKEND_SYMBOLS[index % BACKEND_SYMBOLS.length] };
}
