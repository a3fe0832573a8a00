// Structural copies of the design document's spread types (contract: design/designSchema.ts).
// The statistics code depends only on these shapes, so it can be tested without the models.

/** How one part's value is distributed around its nominal (tolerance in percent). */
export type SpreadSpec =
  | { kind: 'normal'; k?: number }
  | { kind: 'uniform' }
  | { kind: 'truncnormal'; k?: number }
  | { kind: 'binned'; inner: number; k?: number }
  | { kind: 'lognormal'; k?: number }
  | { kind: 'fixed' }
  | { kind: 'empirical'; values: number[]; lot?: { id?: string; name: string } };

/** A toleranced part after value resolution: nominal in ohms, tolerance in percent. */
export type PartSpec = { value: number; tolerance: number; spread: SpreadSpec };

/** Tube section spread (percent, 1σ) and pairing rule; see the design contract. */
export type TubeSpreadSpec = {
  perveanceSd: number;
  muSd: number;
  sectionCorrelation: number;
  pairing?: { quantity: 'ia' | 'gm' | 'mu'; within: number };
  /** Measured tubes, each [perv1, perv2, mu1, mu2]; drawn whole when present. */
  lot?: { id?: string; name: string; tubes: [number, number, number, number][] };
};
