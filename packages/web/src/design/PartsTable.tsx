import { useFormContext } from 'react-hook-form';
import type { Design, PartName } from '@sigmatail/engine';
import { PartRow } from './PartRow.js';
import { Table } from '../components/Table.js';

const REQUIRED: [PartName, string][] = [
  ['rl1', 'RL1'],
  ['rl2', 'RL2'],
  ['rk', 'Rk'],
  ['rt', 'Rt'],
  ['rg1', 'RG1'],
  ['rg2', 'RG2'],
];
// The split-load splitter is one section: RL1 is its plate load, Rk the bias resistor from the
// cathode to the grid-return point, Rt the cathode load to ground; RL2 and RG2 are not used.
const SPLIT_LOAD_REQUIRED: [PartName, string][] = [
  ['rl1', 'RL (plate load)'],
  ['rk', 'Rb (bias, cathode to grid return)'],
  ['rt', 'RK (cathode load to ground)'],
  ['rg1', 'RG (grid leak to grid return)'],
];
const SPLIT_LOAD_OPTIONAL: [PartName, string, string][] = [
  ['rload1', 'Rload1 (on the plate)', '220k'],
  ['rload2', 'Rload2 (on the cathode)', '220k'],
  ['rsource', 'Rsource', '10k'],
];
const OPTIONAL: [PartName, string, string][] = [
  ['rload1', 'Rload1', '220k'],
  ['rload2', 'Rload2', '220k'],
  ['rsource', 'Rsource', '10k'],
];
// Capacitors (design format 2): absent coupling/bypass = ideal, absent stray = none. Defaults are
// typical film values (from memory) and a wiring estimate for the stray capacitance.
const CAPACITORS: [PartName, string, string, number][] = [
  ['cin', 'Cin (input coupling)', '22n', 10],
  ['cg2', 'Cg2 (grid 2 bypass)', '100n', 10],
  ['cout1', 'Cout1 (output 1 coupling)', '22n', 10],
  ['cout2', 'Cout2 (output 2 coupling)', '22n', 10],
  ['cstray1', 'Cstray1 (plate 1 stray)', '47p', 30],
  ['cstray2', 'Cstray2 (plate 2 stray)', '47p', 30],
];
// The split-load splitter has no second grid to bypass; its second output is the cathode.
const SPLIT_LOAD_CAPACITORS: [PartName, string, string, number][] = [
  ['cin', 'Cin (input coupling)', '22n', 10],
  ['cout1', 'Cout1 (plate coupling)', '47n', 10],
  ['cout2', 'Cout2 (cathode coupling)', '47n', 10],
  ['cstray1', 'Cstray1 (plate stray)', '47p', 30],
  ['cstray2', 'Cstray2 (cathode stray)', '47p', 30],
];

/**
 * Every toleranced part of the stage: the resistors (loads and source resistance can be left out)
 * and the capacitors that shape the frequency response (all optional).
 */
export function PartsTable({ readOnly }: { readOnly: boolean }) {
  const { watch, setValue } = useFormContext<Design>();
  const parts = watch('parts');
  const splitLoad = watch('topology') === 'split-load';
  const required = splitLoad ? SPLIT_LOAD_REQUIRED : REQUIRED;
  const optional = splitLoad ? SPLIT_LOAD_OPTIONAL : OPTIONAL;
  const capacitors = splitLoad ? SPLIT_LOAD_CAPACITORS : CAPACITORS;
  return (
    <div className="overflow-x-auto">
      <Table
        className="w-full min-w-[640px]"
        head={
          <>
            <th className="py-1.5 font-medium">Part</th>
            <th className="font-medium">
              Value
              <span className="block text-[11px] leading-tight font-normal text-dim">
                4k7, 2.2k, 1M, 22n…
              </span>
            </th>
            <th className="font-medium">Tolerance</th>
            <th className="font-medium">Kind</th>
            <th className="font-medium">Spread</th>
            <th className="font-medium">Spread parameters</th>
          </>
        }
      >
        {required.map(([n, l]) => (
          <PartRow key={n} name={n} label={l} />
        ))}
        {optional.map(([n, l]) => parts?.[n] && <PartRow key={n} name={n} label={l} />)}
        {capacitors.map(([n, l]) => parts?.[n] && <PartRow key={n} name={n} label={l} />)}
      </Table>
      <div className="mt-2 flex flex-wrap gap-3 text-sm">
        {optional.map(([n, l, dflt]) => (
          <label key={n} className="flex items-center gap-1.5 text-dim">
            <input
              type="checkbox"
              disabled={readOnly}
              checked={!!parts?.[n]}
              onChange={(e) =>
                setValue(
                  `parts.${n}`,
                  e.target.checked ? { value: dflt, tolerance: 5, spread: { kind: 'normal' } } : undefined,
                  {
                    shouldDirty: true,
                    shouldValidate: true,
                  },
                )
              }
            />
            {l.split(' (')[0]} fitted
          </label>
        ))}
      </div>
      <div className="mt-2 flex flex-wrap gap-3 text-sm">
        {capacitors.map(([n, l, dflt, tol]) => (
          <label key={n} className="flex items-center gap-1.5 text-dim">
            <input
              type="checkbox"
              disabled={readOnly}
              checked={!!parts?.[n]}
              onChange={(e) =>
                setValue(
                  `parts.${n}`,
                  e.target.checked ? { value: dflt, tolerance: tol, spread: { kind: 'normal' } } : undefined,
                  { shouldDirty: true, shouldValidate: true },
                )
              }
            />
            {l.split(' ')[0]} fitted
          </label>
        ))}
        <span className="text-xs text-dim">
          {splitLoad
            ? 'Capacitors left out are ideal (coupling) or absent (stray).'
            : 'Capacitors left out are ideal (coupling, bypass) or absent (stray).'}
        </span>
      </div>
    </div>
  );
}
