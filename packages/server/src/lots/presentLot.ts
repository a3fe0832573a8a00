import { summarizeLot, type LotSummary } from '@sigmatail/engine';
import type { ResistorLotData, TubeLotData } from '@sigmatail/db';
import type { LotRow } from './lotsRepo.js';

/** One summarised quantity of a lot, with its label and unit. */
export type LotQuantity = { key: string; label: string; unit: string; summary: LotSummary };

/**
 * A lot as the detail page shows it: its fields and one summary per measured quantity (resistor:
 * the values; tube: each measured quantity with both sections pooled, and the section-to-section
 * ratio of Ia or mu, which pairing acts on), plus the lot's own section correlation.
 */
export function presentLot(row: LotRow) {
  const { data, ...fields } = row;
  const quantities: LotQuantity[] = [];
  let sectionCorrelation: number | null = null;
  if (row.kind === 'resistor') {
    quantities.push({
      key: 'value',
      label: 'Value',
      unit: 'Ω',
      summary: summarizeLot((data as ResistorLotData).values),
    });
  } else {
    const { sections, multipliers } = data as TubeLotData;
    const both = (i: number, scale = 1) => sections.flatMap((s) => [s[i]! * scale, s[i + 2]! * scale]);
    if (row.quantity === 'ia-gm') {
      quantities.push(
        // Stored as measured (mA, mA/V); shown in A and S so SI prefixes read naturally.
        { key: 'ia', label: 'Ia, both sections', unit: 'A', summary: summarizeLot(both(0, 1e-3)) },
        { key: 'gm', label: 'gm, both sections', unit: 'S', summary: summarizeLot(both(1, 1e-3)) },
        {
          key: 'iaRatio',
          label: 'Ia section 1 / section 2',
          unit: '',
          summary: summarizeLot(sections.map((s) => s[0]! / s[2]!)),
        },
      );
    } else {
      quantities.push(
        { key: 'mu', label: 'mu, both sections', unit: '', summary: summarizeLot(both(0)) },
        { key: 'rp', label: 'rp, both sections', unit: 'Ω', summary: summarizeLot(both(1)) },
        {
          key: 'muRatio',
          label: 'mu section 1 / section 2',
          unit: '',
          summary: summarizeLot(sections.map((s) => s[0]! / s[2]!)),
        },
      );
    }
    sectionCorrelation = correlation(
      multipliers.map((m) => Math.log(m[0]!)),
      multipliers.map((m) => Math.log(m[1]!)),
    );
  }
  return { ...fields, quantities, sectionCorrelation };
}

function correlation(a: number[], b: number[]): number | null {
  const n = a.length;
  if (n < 3) return null;
  const ma = a.reduce((s, v) => s + v, 0) / n;
  const mb = b.reduce((s, v) => s + v, 0) / n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    sab += (a[i]! - ma) * (b[i]! - mb);
    saa += (a[i]! - ma) ** 2;
    sbb += (b[i]! - mb) ** 2;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : null;
}
