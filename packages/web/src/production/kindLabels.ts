import type { ResistorKind } from '@sigmatail/engine';

/** How each resistor kind reads on screen. */
export const KIND_LABELS: Record<ResistorKind, string> = {
  'metal-film': 'Metal film',
  'carbon-film': 'Carbon film',
  'carbon-comp': 'Carbon composition',
};
