/**
 * Limits of a lot upload, shared by the server's upload route and the web form (stated once).
 */

/** Largest accepted CSV file, bytes (1 MiB: ~20 000 rows of four numbers). */
export const MAX_LOT_BYTES = 1024 * 1024;
/** Most data rows in one lot. */
export const MAX_LOT_ROWS = 20_000;
/** Row errors reported for one refused file (the rest are counted, not listed). */
export const MAX_LOT_ROW_ERRORS = 50;
/** Kinds of lot: one resistor value per row, or one tube (two sections) per row. */
export const LOT_KINDS = ['resistor', 'tube'] as const;
/** Tube lot measurements: Ia (mA) and gm (mA/V) at a test point, or mu and rp (Ω). */
export const TUBE_LOT_QUANTITIES = ['ia-gm', 'mu-rp'] as const;
/** CSV columns each kind needs (header row, any order, extra columns ignored). */
export const LOT_COLUMNS = {
  resistor: ['value'],
  'ia-gm': ['ia1', 'gm1', 'ia2', 'gm2'],
  'mu-rp': ['mu1', 'rp1', 'mu2', 'rp2'],
} as const;
