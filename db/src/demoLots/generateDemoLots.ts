// Writes the demo workshop's invented lots (run once; the CSVs are committed):
//   node_modules/.bin/tsx --conditions=@sigmatail/source db/src/demoLots/generateDemoLots.ts
import { writeFileSync } from 'node:fs';
import { createStream, normalQuantile } from '@sigmatail/engine';

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

// 12AX7 tubes at 250 V / −2 V: Ia (mA) and gm (mA/V) per section. One envelope's sections share
// most of their spread (same cathode coating batch), each adds its own.
const tubes: string[] = [];
for (let i = 0; i < 200; i++) {
  const envelope = 0.1 * z();
  const row: string[] = [];
  for (let s = 0; s < 2; s++) {
    const perv = Math.exp(envelope + 0.04 * z());
    const muShift = 1 + 0.02 * z();
    row.push((1.2 * perv).toFixed(4), (1.6 * Math.pow(perv, 0.9) * muShift).toFixed(4));
  }
  tubes.push(row.join(','));
}
writeFileSync(new URL('12ax7-incoming.csv', dir), 'ia1,gm1,ia2,gm2\n' + tubes.join('\n') + '\n');
