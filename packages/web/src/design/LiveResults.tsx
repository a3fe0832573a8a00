import type { ReactNode } from 'react';
import { formatSi, formatSig } from '../format/formatSi.js';
import type { NominalState } from './useNominal.js';
import { FrequencyPanel } from './FrequencyPanel.js';
import { LargeSignalPanel } from './LargeSignalPanel.js';
import { SplitLoadResults } from './SplitLoadResults.js';

function Row({ label, children, warn = false }: { label: ReactNode; children: ReactNode; warn?: boolean }) {
  return (
    <div className={`flex items-baseline justify-between gap-3 py-0.5 ${warn ? 'text-brick' : ''}`}>
      <dt className="text-sm text-dim">{label}</dt>
      <dd className="num text-sm">{children}</dd>
    </div>
  );
}

/** Nominal results computed in the browser by the engine while the design is edited. */
export function LiveResults({ state }: { state: NominalState }) {
  if (!state.ok) {
    return (
      <section aria-label="Live nominal results" className="rounded-lg border border-rule bg-sheet p-4">
        <h2 className="mb-2 text-sm font-semibold tracking-wide text-petrol uppercase">Nominal results</h2>
        <p className="mb-2 text-sm text-dim">Fix these fields to see results:</p>
        <ul className="space-y-1 text-sm text-brick" role="list">
          {state.errors.slice(0, 8).map((e, i) => (
            <li key={i}>
              <span className="num text-xs">{e.path}</span>: {e.message}
            </li>
          ))}
        </ul>
      </section>
    );
  }
  const { report } = state;
  const m = report.metrics;
  const pdMax = report.ratings.plateDissipation;
  const hkMax = report.ratings.heaterCathode;
  return (
    <section
      aria-label="Live nominal results"
      className="space-y-4 rounded-lg border border-rule bg-sheet p-4"
    >
      <h2 className="text-sm font-semibold tracking-wide text-petrol uppercase">Nominal results</h2>
      {report.status !== 'ok' && (
        <p role="alert" className="rounded-md bg-brick-soft px-3 py-2 text-sm text-brick">
          No operating point: {report.diagnosis}
        </p>
      )}
      {report.warnings.length > 0 && (
        <ul
          role="alert"
          aria-label="Rating warnings"
          className="space-y-1 rounded-md bg-brick-soft px-3 py-2 text-sm text-brick"
        >
          {report.warnings.map((w) => (
            <li key={w.code + w.message}>⚠ {w.message}</li>
          ))}
        </ul>
      )}
      {report.status === 'ok' && state.design.topology === 'split-load' && (
        <>
          <SplitLoadResults report={report} />
          <FrequencyPanel design={state.design} metrics={m} />
          <LargeSignalPanel design={state.design} />
        </>
      )}
      {report.status === 'ok' && state.design.topology !== 'split-load' && (
        <>
          <div>
            <h3 className="mb-1 text-xs font-semibold text-ink">Gain and balance</h3>
            <dl>
              <Row label="A11 (grid 1 → plate 1)">{formatSig(m.a11)}</Row>
              <Row label="A12 (grid 1 → plate 2)">{formatSig(m.a12)}</Row>
              <Row label="Differential gain">{formatSig(m.gainDiff)}</Row>
              <Row label="Balance |A12|/|A11|" warn={Math.abs(m.balanceDb) > 1}>
                <span data-testid="balance">{formatSi(m.balanceDb, 'dB')}</span>
              </Row>
              <Row label="CMRR">{formatSi(m.cmrrDb, 'dB')}</Row>
              <Row label="Zout 1 / Zout 2">
                {formatSi(m.zout1, 'Ω')} / {formatSi(m.zout2, 'Ω')}
              </Row>
              <Row label="Zin">{formatSi(m.zin, 'Ω')}</Row>
            </dl>
          </div>
          <div>
            <h3 className="mb-1 text-xs font-semibold text-ink">Operating point</h3>
            <table className="w-full text-sm">
              <thead>
                <tr className="text-left text-xs text-dim">
                  <th className="font-normal" />
                  <th className="font-normal">Section 1</th>
                  <th className="font-normal">Section 2</th>
                </tr>
              </thead>
              <tbody className="num">
                <tr>
                  <th scope="row" className="text-left font-normal text-dim">
                    Ia
                  </th>
                  <td>{formatSi(m.ia1, 'A')}</td>
                  <td>{formatSi(m.ia2, 'A')}</td>
                </tr>
                <tr>
                  <th scope="row" className="text-left font-normal text-dim">
                    Va
                  </th>
                  <td>{formatSi(m.va1, 'V')}</td>
                  <td>{formatSi(m.va2, 'V')}</td>
                </tr>
                <tr>
                  <th scope="row" className="text-left font-normal text-dim">
                    Vgk
                  </th>
                  <td>{formatSi(m.vgk1, 'V')}</td>
                  <td>{formatSi(m.vgk2, 'V')}</td>
                </tr>
                <tr>
                  <th
                    scope="row"
                    className="text-left font-normal text-dim"
                    title={`Rating ${pdMax} W per section`}
                  >
                    Pd
                  </th>
                  <td className={m.pd1 > pdMax ? 'font-semibold text-brick' : ''}>{formatSi(m.pd1, 'W')}</td>
                  <td className={m.pd2 > pdMax ? 'font-semibold text-brick' : ''}>{formatSi(m.pd2, 'W')}</td>
                </tr>
                <tr>
                  <th scope="row" className="text-left font-normal text-dim">
                    gm
                  </th>
                  <td>{formatSi(m.gm1, 'S')}</td>
                  <td>{formatSi(m.gm2, 'S')}</td>
                </tr>
                <tr>
                  <th scope="row" className="text-left font-normal text-dim">
                    rp
                  </th>
                  <td>{formatSi(m.rp1, 'Ω')}</td>
                  <td>{formatSi(m.rp2, 'Ω')}</td>
                </tr>
                <tr>
                  <th scope="row" className="text-left font-normal text-dim">
                    mu
                  </th>
                  <td>{formatSig(m.mu1)}</td>
                  <td>{formatSig(m.mu2)}</td>
                </tr>
              </tbody>
            </table>
            <dl className="mt-1">
              <Row label="Plate dissipation rating">{pdMax} W per section</Row>
              <Row label="Cathode Vk">{formatSi(m.vk, 'V')}</Row>
              <Row label={`Heater–cathode (max ±${hkMax} V)`} warn={Math.abs(m.vhk) > hkMax}>
                {formatSi(m.vhk, 'V')}
              </Row>
            </dl>
          </div>
          {report.trim && (
            <div>
              <h3 className="mb-1 text-xs font-semibold text-ink">Trim: RL2 for equal outputs</h3>
              {Number.isFinite(report.trim.exact.rl2) ? (
                <dl data-testid="trim">
                  <Row label="Exact">{formatSi(report.trim.exact.rl2, 'Ω', 4)}</Row>
                  <Row label="Nearest E24">
                    {formatSi(report.trim.e24.rl2, 'Ω')} → {formatSi(report.trim.e24.balanceDb, 'dB', 2)}
                  </Row>
                  <Row label="Nearest E96">
                    {formatSi(report.trim.e96.rl2, 'Ω')} → {formatSi(report.trim.e96.balanceDb, 'dB', 2)}
                  </Row>
                </dl>
              ) : (
                <p className="text-sm text-dim">
                  No RL2 within ×10 of the present value balances this stage.
                </p>
              )}
            </div>
          )}
          <FrequencyPanel design={state.design} metrics={m} />
          <LargeSignalPanel design={state.design} />
        </>
      )}
    </section>
  );
}
