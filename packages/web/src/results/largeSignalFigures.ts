import type { LargeSignalSpread, LargeSignalSummary } from '@sigmatail/engine';

/** One per-sample large-signal figure as the run page and the compare view show it. */
export type LargeSignalFigure = {
  key: string;
  label: string;
  unit: 'V' | '%';
  get: (s: LargeSignalSpread) => LargeSignalSummary | undefined;
};

/** The figures in reading order: drive range, swing per output, then distortion per output (output 1 is plate 1; output 2 is plate 2 of a long-tailed pair, the cathode of a split-load stage). */
export const LARGE_SIGNAL_FIGURES: readonly LargeSignalFigure[] = [
  { key: 'driveLimit', label: 'Symmetrical drive limit, grid 1', unit: 'V', get: (s) => s.driveSymmetric },
  { key: 'swing1', label: 'Symmetrical swing, output 1', unit: 'V', get: (s) => s.swing1 },
  { key: 'swing2', label: 'Symmetrical swing, output 2', unit: 'V', get: (s) => s.swing2 },
  { key: 'thd1', label: 'THD, out 1', unit: '%', get: (s) => s.thd1Percent },
  { key: 'h21', label: 'H2, out 1', unit: '%', get: (s) => s.h2Percent1 },
  { key: 'h31', label: 'H3, out 1', unit: '%', get: (s) => s.h3Percent1 },
  { key: 'thd2', label: 'THD, out 2', unit: '%', get: (s) => s.thd2Percent },
  // Runs stored before output 2's harmonics were kept have no h2Percent2 / h3Percent2.
  { key: 'h22', label: 'H2, out 2', unit: '%', get: (s) => s.h2Percent2 },
  { key: 'h32', label: 'H3, out 2', unit: '%', get: (s) => s.h3Percent2 },
];
