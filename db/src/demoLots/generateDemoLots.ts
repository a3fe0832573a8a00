// Writes the demo workshop's invented lots (run once; the CSVs are committed):
//   node_modules/.bin/tsx --conditions=@sigmatail/source db/src/demoLots/generateDemoLots.ts
import { writeFileSync } from 'node:fs';
import { TUBE_CATALOG, createStream, korenPointInto, normalQuantile } from '@sigmatail/engine';

const dir = new URL('./', import.meta.url);
const rng = createStream('fenwick-demo-lots');
const z = () => normalQuantile(rng.nextOpen());

// 470 Ω 1 % metal film for Rk: sits 0.3 % low, σ 0.35 %.
const rk = Array.from({ length: 300 }, () => (470 * (1 - 0.003 + 0.0035 * z())).toFixed(2));
writeFileSync(new URL('rk-470R-metal-film.csv', dir), 'value\n' + rk.join('\n') + '\n');

// 10 kΩ 5 % carbon film for Rt, from a reel the ±1 % parts were sorted out of (σ 5/3 %, cut at ±5 %).
const rt: string[] = [];
while (rt.length < 300) {
  const r = (5 / 3) * z();
  if (Math.abs(r) > 1 && Math.abs(r) <= 5) rt.push((10e3 * (1 + r / 100)).toFixed(1));
}
writeFileSync(new URL('rt-10k-carbon-binned.csv', dir), 'value\n' + rt.join('\n') + '\n');

// 12AX7 tubes at 250 V / −2 V: Ia (mA) and gm (mA/V) per section, as the catalog's model gives them
// for sections whose current scale and mu are spread around the model's (so the lot centres on the
// model the designs use). One envelope's sections share most of their spread (same cathode
// coating batch), each adds its own.
const model = TUBE_CATALOG['12AX7'].model;
const pt = { ia: 0, gm: 0, ga: 0 };
const tubes: string[] = [];
for (let i = 0; i < 200; i++) {
  const envelope = 0.1 * z();
  const row: string[] = [];
  for (let s = 0; s < 2; s++) {
    const perv = Math.exp(envelope + 0.04 * z());
    const mu = Math.exp(0.02 * z());
    korenPointInto(model, 250, -2, perv, mu, pt);
    row.push((pt.ia * 1e3).toFixed(4), (pt.gm * 1e3).toFixed(4));
  }
  tubes.push(row.join(','));
}
writeFileSync(new URL('12ax7-incoming.csv', dir), 'ia1,gm1,ia2,gm2\n' + tubes.join('\n') + '\n');
