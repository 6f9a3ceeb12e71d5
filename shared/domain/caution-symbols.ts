import type { Caution } from './animal-facts';

/**
 * Rackside's own caution symbols as SVG path data on a 24 × 24 grid, stroked round at 2.2.
 * One source for the screen (React icons) and for printed labels (HTML and PDF), so a label
 * shows the same mark the round does.
 */
export const CAUTION_SYMBOL_PATHS: Record<Caution, readonly string[]> = {
  // Two fangs under a bar.
  potent_venom: [
    'M4 4h16',
    'M7 4c0 6 1.5 11 4 15-3-1-5.5-5-5.5-10',
    'M17 4c0 6-1.5 11-4 15 3-1 5.5-5 5.5-10',
  ],
  // Short bristles flying off a curve.
  urticating_hairs: ['M4 19c4-1 7-4 8-9', 'M12 5l1-3M16 7l3-2M17 11l3 0M15 15l2 2M9 8L7 5'],
  // A zigzag dash.
  fast_defensive: ['M13 2L5 13h6l-1 9 8-11h-6z'],
  // An enclosure with its lid lifted on one side, and something climbing out through the gap.
  escape_risk: ['M4 11v10h16V11', 'M3 9.5L20 4', 'M11 18v-9M8 12l3-3 3 3'],
  // A tail curling up and over, ending in a barb.
  sting: ['M4 21c8 0 13-4 13-11 0-3-2-6-5-6', 'M12 4l-2 4 4 0z'],
};
export const CAUTION_SYMBOL_GRID = 24;
export const CAUTION_SYMBOL_STROKE = 2.2;
