/** Colours and sizes shared by every chart (the SVG export carries them inline). */
export const SERIES_COLOURS = ['#0f3b3a', '#c2561d', '#5d7f2f', '#7a4b8c'] as const;
export const INK = '#15292c';
export const DIM = '#55656a';
export const GRID = '#e6dfcd';
export const SPEC = '#9e2a22';
export const FONT = 'Inter, ui-sans-serif, system-ui, sans-serif';
export const MONO = "'Roboto Mono', ui-monospace, monospace";
export const MARGIN = { top: 14, right: 16, bottom: 40, left: 56 };
