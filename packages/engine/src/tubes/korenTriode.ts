/**
 * Parameters of the triode plate-current model of N. Koren, "Improved VT models for SPICE
 * simulations" (Glass Audio, 1996).
 */
export interface KorenParams {
  /** Amplification factor (dimensionless). */
  mu: number;
  /** Exponent of the current law (dimensionless, about 1.3–1.4). */
  ex: number;
  /** Current scale (V^ex / A): larger kg1 means less current. */
  kg1: number;
  /** Softplus sharpness near cut-off (dimensionless). */
  kp: number;
  /** Knee of the plate-voltage dependence of mu (V²). */
  kvb: number;
}

/** Plate current and its partial derivatives at one (Vpk, Vgk). */
export interface TriodePoint {
  /** Plate current (A). */
  ia: number;
  /** ∂Ia/∂Vgk, transconductance (S). */
  gm: number;
  /** ∂Ia/∂Vpk, plate conductance (S) = 1/rp. */
  ga: number;
}

/**
 * Plate current (A) of one triode section, Koren 1996:
 *   E1 = (Ep/kp)·ln(1 + exp(kp·(1/mu + Eg/sqrt(kvb + Ep²))))
 *   Ip = (E1^ex / kg1)·(1 + sgn(E1))
 * The (1 + sgn) factor is kept as published: for E1 > 0 it doubles the current, Ip = 2·E1^ex/kg1.
 * The paper's model listing writes the same thing as (pwr(E1,ex) + pwrs(E1,ex))/kg1 (from
 * memory), so the published parameter sets were fitted with the factor 2 and the catalog assumes
 * it. Checked against the datasheet typical points (tubeCatalog.test.ts): the 12AX7 set gives
 * 0.95 mA at 250 V / −2 V with the factor (datasheet 1.2 mA) and 0.48 mA without it, and it
 * reproduces a published worked example (1.07 mA, 1880 µS at 221 V / −1.61 V) only with it.
 * Some circulated listings divide by 2·kg1 instead; with those the published sets would give
 * half the datasheet currents, so that form is not the one they were fitted with.
 * `scale` multiplies the current (perveance spread); `muScale` multiplies mu.
 * No grid current is modelled; callers flag Vgk > 0.
 *
 * @example
 * korenCurrent(TUBE_CATALOG['12AX7'].model, 250, -2); // ≈ 0.95e-3 A
 */
export function korenCurrent(p: KorenParams, vpk: number, vgk: number, scale = 1, muScale = 1): number {
  if (vpk <= 0) return 0;
  const s = Math.sqrt(p.kvb + vpk * vpk);
  const u = p.kp * (1 / (p.mu * muScale) + vgk / s);
  const e1 = (vpk / p.kp) * softplus(u);
  if (e1 <= 0) return 0;
  return (scale * 2 * Math.pow(e1, p.ex)) / p.kg1;
}

/**
 * ln(1 + e^u) without overflow for large u or loss for very negative u.
 *
 * @example
 * softplus(0); // ≈ 0.693
 */
export function softplus(u: number): number {
  return u > 30 ? u : u < -30 ? Math.exp(u) : Math.log1p(Math.exp(u));
}

/**
 * Plate current with analytic partial derivatives (gm = ∂Ia/∂Vgk, ga = ∂Ia/∂Vpk = 1/rp), written
 * into `out` so hot loops allocate nothing. Volts in, amperes and siemens out.
 *
 * @example
 * const pt = { ia: 0, gm: 0, ga: 0 };
 * korenPointInto(TUBE_CATALOG['12AX7'].model, 250, -2, 1, 1, pt); // pt.gm ≈ 1.67e-3 S
 */
export function korenPointInto(
  p: KorenParams,
  vpk: number,
  vgk: number,
  scale: number,
  muScale: number,
  out: TriodePoint,
): TriodePoint {
  const io = SCRATCH;
  io[0] = vpk;
  io[1] = vgk;
  io[2] = scale;
  io[3] = muScale;
  korenPointArr(p, io, 0);
  out.ia = io[4];
  out.gm = io[5];
  out.ga = io[6];
  return out;
}

const SCRATCH = new Float64Array(7);

/**
 * {@link korenPointInto} on a Float64Array, for the per-sample bias solve: reads Vpk (V), Vgk (V),
 * current scale and mu scale from io[at..at+3] and writes Ia (A), gm (S), ga (S) to
 * io[at+4..at+6]. Doubles passed as arguments to a call the optimiser does not inline are boxed
 * (a heap number each); through the array nothing is allocated.
 *
 * @example
 * io.set([250, -2, 1, 1]); korenPointArr(TUBE_CATALOG['12AX7'].model, io, 0); // io[5] ≈ 1.67e-3 S
 */
export function korenPointArr(p: KorenParams, io: Float64Array, at: number): void {
  const vpk = io[at];
  const vgk = io[at + 1];
  const scale = io[at + 2];
  const muScale = io[at + 3];
  if (vpk <= 0) {
    io[at + 4] = 0;
    io[at + 5] = 0;
    io[at + 6] = 0;
    return;
  }
  const kp = p.kp;
  const s = Math.sqrt(p.kvb + vpk * vpk);
  const u = kp * (1 / (p.mu * muScale) + vgk / s);
  let L: number;
  let sig: number;
  if (u > 30) {
    L = u;
    sig = 1;
  } else {
    const eu = Math.exp(u);
    L = u < -30 ? eu : Math.log1p(eu);
    sig = eu / (1 + eu);
  }
  const e1 = (vpk / kp) * L;
  if (!(e1 > 0)) {
    io[at + 4] = 0;
    io[at + 5] = 0;
    io[at + 6] = 0;
    return;
  }
  const k = (scale * 2) / p.kg1;
  // exp(·log) instead of Math.pow: the same value to a few ulp and markedly faster in V8.
  const pw = Math.exp((p.ex - 1) * Math.log(e1));
  const dIdE = k * p.ex * pw;
  io[at + 4] = k * pw * e1;
  io[at + 5] = dIdE * ((vpk * sig) / s);
  io[at + 6] = dIdE * (L / kp - (vpk * vpk * vgk * sig) / (s * s * s));
}
