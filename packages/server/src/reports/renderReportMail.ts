import { escapeHtml } from '../mail/escapeHtml.js';
import type { PpmInterval, ProductionReport } from './productionReport.js';

export const CAUTION =
  'High voltage: these circuits carry lethal voltages even when switched off. Discharge filter capacitors before ' +
  'touching anything and respect every part and tube rating. Sigmatail is a design aid; its results do not ' +
  'replace local electrical codes or licensed practice.';

const pct = (x: number) => `${(x * 100).toFixed(3)} %`;
const ppm = (x: number) => `${Math.round(x).toLocaleString('en-US')} PPM`;
const num = (x: number | null) => (x === null ? '—' : Number(x.toPrecision(4)).toString());
const range = (r: [number, number] | null, f: (x: number) => string) => (r ? `${f(r[0])} – ${f(r[1])}` : '—');

const money = (x: number, currency: string | null) => `${x.toFixed(2)} ${currency ?? ''}`.trim();
const ppmRange = (x: PpmInterval) => `${ppm(x.ppm)} (95 % ${ppm(x.lowPpm)} – ${ppm(x.highPpm)})`;
const limits = (l: { low?: number; high?: number }) =>
  `${l.low === undefined ? '−∞' : num(l.low)} … ${l.high === undefined ? '∞' : num(l.high)}`;

/** Plan, pairing, ageing and test-limit rows (each says when nothing is saved yet). */
function productionRows(r: ProductionReport): [string, string][] {
  const out: [string, string][] = [];
  const p = r.plan;
  if (!p) out.push(['Tolerance plan', 'none saved yet']);
  else if (!p.chosen) out.push(['Tolerance plan', `no plan meets ${ppm(p.targetPpm)}`]);
  else {
    const classes = Object.entries(p.chosen.classes)
      .map(([part, tol]) => `${part} ${tol} %`)
      .join(', ');
    out.push([
      `Tolerance plan (target ${ppm(p.targetPpm)})`,
      `${classes}, tubes ${p.chosen.tube}; ${money(p.chosen.cost, p.currency)} per unit; estimate ${ppmRange(p.chosen.estimate)}`,
    ]);
    if (p.confirm?.result) out.push(['Confirming run', ppmRange(p.confirm.result)]);
  }
  if (!r.pairing) out.push(['Pairing', 'no comparison saved yet']);
  for (const s of r.pairing?.strategies ?? []) {
    out.push([
      `Pairing: ${s.label}`,
      `${ppmRange(s.reject)}, ${money(s.costPerGoodUnit, r.pairing!.currency)} per good unit, ${s.tubesThrownPerUnit.toFixed(2)} tubes thrown away per unit`,
    ]);
  }
  const a = r.ageing;
  if (!a) out.push(['Ageing', 'no ageing result saved yet']);
  else {
    out.push(['Reject rate new / aged', `${ppmRange(a.asNew)} / ${ppmRange(a.aged)}`]);
    for (const s of a.specs) out.push([`Margin after ageing: ${s.label}`, num(s.margin)]);
  }
  const l = r.limits;
  if (!l) out.push(['Test limits', 'none saved yet']);
  else
    out.push([
      `Test limits${l.metric ? ` (${l.metric})` : ''}`,
      `test ${limits(l.test)} against spec ${limits(l.spec)}, measurement sd ${num(l.measurementSd)}: false accept ${ppm(l.falseAcceptPpm)}, false reject ${ppm(l.falseRejectPpm)}`,
    ]);
  return out;
}

/** Lines of the report as label/value rows, shared by the text and HTML bodies. */
function rows(r: ProductionReport): [string, string][] {
  const out: [string, string][] = [
    ['Workspace', r.workspace.name],
    ['Design', `${r.design.name} (revision ${r.design.revision}, ${r.design.topology}, ${r.design.tube})`],
  ];
  if (!r.run) return [...out, ['Run', 'no finished run yet'], ...productionRows(r)];
  const j = r.run.joint;
  out.push(
    [
      'Run',
      `${r.run.samples.toLocaleString('en-US')} samples, ${r.run.plan}, seed ${r.run.seed}, revision ${r.run.revision}`,
    ],
    ['Joint yield', `${pct(j.yield)} (95 % Wilson ${range(j.wilson, pct)})`],
    ['Reject rate', ppm(j.ppm)],
  );
  for (const s of r.run.specs) {
    const limits = `${s.min === null ? '' : `≥ ${num(s.min)}`}${s.min !== null && s.max !== null ? ', ' : ''}${s.max === null ? '' : `≤ ${num(s.max)}`}`;
    out.push([
      `Spec ${s.label ?? s.metric} (${limits})`,
      `yield ${pct(s.yield)}, ${ppm(s.ppm)}, Cpk ${num(s.cpk)} (95 % ${range(s.cpkInterval, num)})`,
    ]);
  }
  return [...out, ...productionRows(r)];
}

/** The mail that carries a production report: a summary in text and HTML, with a link to the printable page. */
export function renderReportMail(
  r: ProductionReport,
  o: { link: string; senderName: string; note?: string },
): { subject: string; text: string; html: string } {
  const lines = rows(r);
  const warnings = r.warnings.map((w) => `Rating exceeded: ${w.message}`);
  const text = [
    `${o.senderName} sent you the Sigmatail production report of ${r.design.name}.`,
    ...(o.note ? ['', o.note] : []),
    '',
    ...lines.map(([k, v]) => `${k}: ${v}`),
    ...(warnings.length ? ['', ...warnings] : []),
    '',
    `Printable report: ${o.link}`,
    '',
    CAUTION,
  ].join('\n');
  const html = [
    `<p>${escapeHtml(o.senderName)} sent you the Sigmatail production report of <b>${escapeHtml(r.design.name)}</b>.</p>`,
    o.note ? `<p>${escapeHtml(o.note)}</p>` : '',
    '<table cellpadding="4" style="border-collapse:collapse">',
    ...lines.map(([k, v]) => `<tr><th align="left">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`),
    '</table>',
    ...warnings.map((w) => `<p><b>${escapeHtml(w)}</b></p>`),
    `<p><a href="${escapeHtml(o.link)}">Open the printable report</a></p>`,
    `<p><i>${escapeHtml(CAUTION)}</i></p>`,
  ].join('\n');
  return {
    subject: `Sigmatail production report: ${r.design.name} (revision ${r.design.revision})`,
    text,
    html,
  };
}
