import { formatRkm, type NominalReport, type ResolvedDesign } from '@sigmatail/engine';
import { formatSi } from '../format/formatSi.js';

const WIRE = '#0f3b3a';
const VALUE = '#a9471a';
const NODE = '#55656a';
const MONO = "'Roboto Mono', ui-monospace, monospace";

/** A vertical resistor body between y1 and y2 at x, with its name and value beside it. */
function Resistor({
  x,
  y1,
  y2,
  name,
  value,
  side = 'right',
}: {
  x: number;
  y1: number;
  y2: number;
  name: string;
  value: string;
  side?: 'left' | 'right';
}) {
  const mid = (y1 + y2) / 2;
  const tx = side === 'right' ? x + 14 : x - 14;
  const anchor = side === 'right' ? 'start' : 'end';
  return (
    <g>
      <line x1={x} x2={x} y1={y1} y2={mid - 18} stroke={WIRE} strokeWidth={2} />
      <line x1={x} x2={x} y1={mid + 18} y2={y2} stroke={WIRE} strokeWidth={2} />
      <rect
        x={x - 7}
        y={mid - 18}
        width={14}
        height={36}
        rx={4}
        fill="#fffdf7"
        stroke={WIRE}
        strokeWidth={2}
      />
      <text x={tx} y={mid - 3} textAnchor={anchor} fontSize={11} fill={WIRE} fontWeight={600}>
        {name}
      </text>
      <text x={tx} y={mid + 11} textAnchor={anchor} fontSize={11} fill={VALUE} fontFamily={MONO}>
        {value}
      </text>
    </g>
  );
}

/** One triode section: envelope, plate bar, dashed grid, cathode bar; leads leave at the given points. */
function Triode({ cx, cy, gridSide }: { cx: number; cy: number; gridSide: 'left' | 'right' }) {
  const gx = gridSide === 'left' ? cx - 48 : cx + 48;
  return (
    <g stroke={WIRE} strokeWidth={2} fill="none">
      <circle cx={cx} cy={cy} r={30} fill="#f5f1e6" />
      <line x1={cx - 14} x2={cx + 14} y1={cy - 14} y2={cy - 14} />
      <line x1={cx} x2={cx} y1={cy - 14} y2={cy - 44} />
      <line x1={cx - 16} x2={cx + 16} y1={cy} y2={cy} strokeDasharray="3 3" />
      <line x1={gridSide === 'left' ? cx - 16 : cx + 16} x2={gx} y1={cy} y2={cy} />
      <path d={`M${cx - 14},${cy + 18} H${cx + 14}`} />
      <line x1={cx} x2={cx} y1={cy + 18} y2={cy + 56} />
    </g>
  );
}

function Dot({ x, y }: { x: number; y: number }) {
  return <circle cx={x} cy={y} r={3.2} fill={WIRE} />;
}

/** Node voltage tag in the mono face. */
function Tag({
  x,
  y,
  text,
  anchor = 'start',
}: {
  x: number;
  y: number;
  text: string;
  anchor?: 'start' | 'end' | 'middle';
}) {
  return (
    <text x={x} y={y} fontSize={10.5} fill={NODE} fontFamily={MONO} textAnchor={anchor}>
      {text}
    </text>
  );
}

/**
 * The long-tailed pair as the app draws it, with the design's part values and the live nominal
 * operating point written on the wires. Plain SVG, so it prints and exports as it looks.
 */
export function StageSchematic({ design, report }: { design: ResolvedDesign; report?: NominalReport }) {
  const p = design.parts;
  const v = (x: number) => formatRkm(x, 'resistance', 3);
  const ok = report?.status === 'ok';
  const m = report?.metrics;
  const cap = design.topology === 'cap-coupled';
  const x1 = 170;
  const x2 = 370;
  const kx = 270;
  const tail = design.supply.tail;
  return (
    <svg
      viewBox="0 0 540 430"
      className="h-auto w-full"
      role="img"
      aria-label="Schematic of the stage"
      fontFamily="Inter, sans-serif"
    >
      {/* B+ rail */}
      <line x1={x1 - 20} x2={x2 + 20} y1={34} y2={34} stroke={WIRE} strokeWidth={2.5} strokeLinecap="round" />
      <text x={kx} y={24} textAnchor="middle" fontSize={12} fontWeight={700} fill={WIRE}>
        B+{' '}
        <tspan fontFamily={MONO} fill={VALUE}>
          {formatSi(design.supply.bPlus, 'V')}
        </tspan>
      </text>
      <Resistor x={x1} y1={34} y2={118} name="RL1" value={v(p.rl1.value)} side="left" />
      <Resistor x={x2} y1={34} y2={118} name="RL2" value={v(p.rl2?.value ?? Number.NaN)} />
      <Dot x={x1} y={118} />
      <Dot x={x2} y={118} />
      {/* outputs */}
      <line x1={x1} x2={x1 - 80} y1={118} y2={118} stroke={WIRE} strokeWidth={2} />
      <path d={`M${x1 - 80},118 l8,-5 v10 z`} fill={WIRE} transform={`rotate(180 ${x1 - 80} 118)`} />
      <text x={x1 - 84} y={110} textAnchor="end" fontSize={11} fill={WIRE}>
        out 1
      </text>
      <line x1={x2} x2={x2 + 80} y1={118} y2={118} stroke={WIRE} strokeWidth={2} />
      <path d={`M${x2 + 80},118 l8,-5 v10 z`} fill={WIRE} transform={`rotate(0 ${x2 + 80} 118)`} />
      <text x={x2 + 92} y={110} fontSize={11} fill={WIRE}>
        out 2
      </text>
      {p.rload1 && <Tag x={x1 - 84} y={96} anchor="end" text={`load ${v(p.rload1.value)}`} />}
      {p.rload2 && <Tag x={x2 + 92} y={96} text={`load ${v(p.rload2.value)}`} />}
      {p.rsource && <Tag x={66} y={146} anchor="end" text={`source ${v(p.rsource.value)}`} />}
      {ok && m && (
        <>
          <Tag x={x1 - 84} y={134} anchor="end" text={`Va1 ${formatSi(m.va1, 'V')}`} />
          <Tag x={x2 + 92} y={134} text={`Va2 ${formatSi(m.va2, 'V')}`} />
          <Tag x={x1 + 8} y={104} text={`${formatSi(m.ia1, 'A')} ↓`} />
          <Tag x={x2 - 8} y={104} anchor="end" text={`↓ ${formatSi(m.ia2, 'A')}`} />
        </>
      )}
      <Triode cx={x1} cy={162} gridSide="left" />
      <Triode cx={x2} cy={162} gridSide="right" />
      <text x={x1 + 36} y={150} fontSize={10} fill={NODE}>
        {design.tube.type} (1)
      </text>
      <text x={x2 - 36} y={150} fontSize={10} fill={NODE} textAnchor="end">
        (2)
      </text>
      {/* cathodes to K */}
      <path d={`M${x1},218 V236 H${x2} V218`} stroke={WIRE} strokeWidth={2} fill="none" />
      <Dot x={kx} y={236} />
      {ok && m && <Tag x={kx + 8} y={230} text={`K ${formatSi(m.vk, 'V')}`} />}
      <Resistor x={kx} y1={236} y2={300} name="Rk" value={v(p.rk.value)} />
      <Dot x={kx} y={300} />
      <text x={kx - 8} y={296} fontSize={10} fill={NODE} textAnchor="end">
        J
      </text>
      <Resistor x={kx} y1={300} y2={372} name="Rt" value={v(p.rt.value)} />
      {tail === 0 ? (
        <g stroke={WIRE} strokeWidth={2}>
          <line x1={kx - 14} x2={kx + 14} y1={372} y2={372} />
          <line x1={kx - 9} x2={kx + 9} y1={378} y2={378} />
          <line x1={kx - 4} x2={kx + 4} y1={384} y2={384} />
        </g>
      ) : (
        <text x={kx} y={390} textAnchor="middle" fontSize={12} fontWeight={700} fill={WIRE}>
          tail{' '}
          <tspan fontFamily={MONO} fill={VALUE}>
            {formatSi(tail, 'V')}
          </tspan>
        </text>
      )}
      {/* grid 1: input and leak */}
      <line x1={x1 - 48} x2={70} y1={162} y2={162} stroke={WIRE} strokeWidth={2} />
      <Dot x={100} y={162} />
      <text x={66} y={158} textAnchor="end" fontSize={11} fill={WIRE}>
        in
      </text>
      {!cap && design.drive && (
        <Tag x={66} y={174} anchor="end" text={`${formatSi(design.drive.grid1Dc, 'V')} DC`} />
      )}
      <Resistor x={100} y1={162} y2={300} name="RG1" value={v(p.rg1.value)} side="left" />
      <line x1={100} x2={kx} y1={300} y2={300} stroke={WIRE} strokeWidth={2} />
      {/* grid 2: leak and AC ground */}
      <line x1={x2 + 48} x2={470} y1={162} y2={162} stroke={WIRE} strokeWidth={2} />
      <Dot x={440} y={162} />
      <Resistor x={440} y1={162} y2={300} name="RG2" value={v(p.rg2?.value ?? Number.NaN)} />
      <line x1={440} x2={kx} y1={300} y2={300} stroke={WIRE} strokeWidth={2} />
      <g stroke={WIRE} strokeWidth={2}>
        <line x1={470} x2={470} y1={162} y2={190} />
        <line x1={460} x2={480} y1={190} y2={190} />
        <line x1={460} x2={480} y1={197} y2={197} />
        <line x1={470} x2={470} y1={197} y2={214} />
        <line x1={462} x2={478} y1={214} y2={214} />
        <line x1={466} x2={474} y1={219} y2={219} />
      </g>
      <text x={484} y={196} fontSize={10} fill={NODE}>
        AC gnd
      </text>
      {ok && m && (
        <text x={kx} y={418} textAnchor="middle" fontSize={11} fill={WIRE}>
          gain{' '}
          <tspan fontFamily={MONO} fill={VALUE}>
            {formatSi(m.gainDiff, '', 3)}
          </tspan>{' '}
          · balance{' '}
          <tspan fontFamily={MONO} fill={VALUE}>
            {formatSi(m.balanceDb, 'dB', 2)}
          </tspan>{' '}
          · Pd{' '}
          <tspan fontFamily={MONO} fill={VALUE}>
            {formatSi(m.pd1, 'W', 2)} / {formatSi(m.pd2, 'W', 2)}
          </tspan>
        </text>
      )}
    </svg>
  );
}
