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
const OPTIONAL: [PartName, string, string][] = [
  ['rload1', 'Rload1', '220k'],
  ['rload2', 'Rload2', '220k'],
  ['rsource', 'Rsource', '10k'],
];

/** Every toleranced resistor of the stage; loads and source resistance can be left out. */
export function PartsTable({ readOnly }: { readOnly: boolean }) {
  const { watch, setValue } = useFormContext<Design>();
  const parts = watch('parts');
  return (
    <div className="overflow-x-auto">
      <Table
        className="w-full min-w-[640px]"
        head={
          <>
            <th className="py-1.5 font-medium">Part</th>
            <th className="font-medium">Value (4k7, 2.2k, 1M…)</th>
            <th className="font-medium">Tolerance</th>
            <th className="font-medium">Spread</th>
            <th className="font-medium">Spread parameters</th>
          </>
        }
      >
        {REQUIRED.map(([n, l]) => (
          <PartRow key={n} name={n} label={l} />
        ))}
        {OPTIONAL.map(([n, l]) => parts?.[n] && <PartRow key={n} name={n} label={l} />)}
      </Table>
      <div className="mt-2 flex flex-wrap gap-3 text-sm">
        {OPTIONAL.map(([n, l, dflt]) => (
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
            {l} fitted
          </label>
        ))}
      </div>
    </div>
  );
}
