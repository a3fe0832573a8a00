import type { NominalReport } from '@sigmatail/engine';
import type { ReactNode } from 'react';
import { formatSi, formatSig } from '../format/formatSi.js';

function Row({ label, children, warn = false }: { label: ReactNode; children: ReactNode; warn?: boolean }) {
  return (
    <div className={`flex items-baseline justify-between gap-3 py-0.5 ${warn ? 'text-brick' : ''}`}>
      <dt className="text-sm text-dim">{label}</dt>
      <dd className="num text-sm">{children}</dd>
    </div>
  );
}

/**
 * The nominal results of a split-load (cathodyne) design: one section, the plate and cathode
 * outputs (engine metrics a11/a12, zout1/zout2), and no trim (there is no RL2). The frequency
 * response and the large signal follow in their own panels.
 */
export function SplitLoadResults({ report }: { report: NominalReport }) {
  const m = report.metrics;
  const pdMax = report.ratings.plateDissipation;
  const hkMax = report.ratings.heaterCathode;
  return (
    <>
      <div>
        <h3 className="mb-1 text-xs font-semibold text-ink">Gain and balance (split-load)</h3>
        <dl>
          <Row label="Gain to plate">{formatSig(m.a11)}</Row>
          <Row label="Gain to cathode">{formatSig(m.a12)}</Row>
          <Row label="Balance |cathode|/|plate|" warn={Math.abs(m.balanceDb) > 1}>
            <span data-testid="balance">{formatSi(m.balanceDb, 'dB')}</span>
          </Row>
          <Row label="Zout plate / cathode">
            {formatSi(m.zout1, 'Ω')} / {formatSi(m.zout2, 'Ω')}
          </Row>
          <Row label="Zin">{formatSi(m.zin, 'Ω')}</Row>
        </dl>
      </div>
      <div>
        <h3 className="mb-1 text-xs font-semibold text-ink">Operating point</h3>
        <dl>
          <Row label="Ia">{formatSi(m.ia1, 'A')}</Row>
          <Row label="Va (plate)">{formatSi(m.va1, 'V')}</Row>
          <Row label="Vk (cathode)">{formatSi(m.vk, 'V')}</Row>
          <Row label="Vgk">{formatSi(m.vgk1, 'V')}</Row>
          <Row label={`Pd (max ${pdMax} W)`} warn={m.pd1 > pdMax}>
            {formatSi(m.pd1, 'W')}
          </Row>
          <Row label="gm / rp / mu">
            {formatSi(m.gm1, 'S')} / {formatSi(m.rp1, 'Ω')} / {formatSig(m.mu1)}
          </Row>
          <Row label={`Heater–cathode (max ±${hkMax} V)`} warn={Math.abs(m.vhk) > hkMax}>
            {formatSi(m.vhk, 'V')}
          </Row>
        </dl>
      </div>
      <p className="text-xs text-dim">
        The cathode sits well above ground: check the heater–cathode rating. There is no RL2 to trim: balance
        follows from the plate and cathode loads.
      </p>
    </>
  );
}
