import { symbolCircle, symbolDiamond, symbolSquare, symbolTriangle, symbolCross, symbolStar, symbolWye, type SymbolType } from 'd3';

/**
 * Categorical colours for groups on a chart (chemistries on the trade-off plot, candidates on
 * their curves). The hues are the colour-blind-safe set of Okabe & Ito, "Color Universal Design"
 * (2008), without its yellow, which is too light on white. Every group also gets its own marker
 * shape, so a group never depends on hue alone.
 */
export const CATEGORY_COLOURS = ['#0072B2', '#E69F00', '#009E73', '#CC79A7', '#D55E00', '#56B4E9', '#000000'] as const;

export const CATEGORY_SYMBOLS: readonly { name: string; type: SymbolType }[] = [
  { name: 'circle', type: symbolCircle },
  { name: 'square', type: symbolSquare },
  { name: 'triangle', type: symbolTriangle },
  { name: 'diamond', type: symbolDiamond },
  { name: 'cross', type: symbolCross },
  { name: 'star', type: symbolStar },
  { name: 'wye', type: symbolWye },
];

/** The colour and marker of the k-th group; after 7 groups the shapes move on, so pairs stay unique up to 49. */
export function categoryStyle(k: number): { colour: string; symbol: SymbolType; symbolName: string } {
  const n = CATEGORY_COLOURS.length;
  const colour = CATEGORY_COLOURS[k % n]!;
  const s = CATEGORY_SYMBOLS[(k + Math.floor(k / n)) % CATEGORY_SYMBOLS.length]!;
  return { colour, symbol: s.type, symbolName: s.name };
}
