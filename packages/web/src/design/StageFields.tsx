import { useFormContext } from 'react-hook-form';
import type { Design } from '@sigmatail/engine';
import { Field } from '../components/Field.js';
import { TextField } from '../components/TextField.js';
import { inputClass } from '../components/ui.js';
import { FieldError } from './formHelpers.js';
import { NumberField } from './NumberField.js';

/** Name, topology, supplies and (direct-coupled) grid drive. */
export function StageFields() {
  const {
    register,
    watch,
    getValues,
    setValue,
    formState: { errors },
  } = useFormContext<Design>();
  // A split-load document may lack section 2's RL2 and RG2; a long-tailed pair needs them, so a
  // switch to a pair starts them as copies of RL1 and RG1.
  const topologyField = register('topology', {
    onChange: (e: { target: { value: string } }) => {
      if (e.target.value === 'split-load') return;
      const opts = { shouldDirty: true, shouldValidate: true };
      if (!getValues('parts.rl2')) setValue('parts.rl2', { ...getValues('parts.rl1') }, opts);
      if (!getValues('parts.rg2')) setValue('parts.rg2', { ...getValues('parts.rg1') }, opts);
    },
  });
  const topology = watch('topology');
  const grid2Mode = watch('drive.grid2.mode');
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <TextField
        id="d-name"
        label="Design name"
        className="sm:col-span-2"
        {...register('name')}
        note={<FieldError error={errors.name} />}
      />
      <Field id="d-notes" label="Notes" className="sm:col-span-2">
        <textarea id="d-notes" rows={2} className={inputClass} {...register('notes')} />
      </Field>
      <Field id="d-topology" label="Topology">
        <select id="d-topology" className={inputClass} {...topologyField}>
          <option value="cap-coupled">Capacitor-coupled (grids leak to J)</option>
          <option value="direct-coupled">Direct-coupled (grid 1 at a DC level)</option>
          <option value="split-load">Split-load (cathodyne)</option>
        </select>
      </Field>
      <div className="grid grid-cols-3 gap-2">
        <NumberField id="d-bplus" label="B+ (V)" name="supply.bPlus" error={errors.supply?.bPlus} />
        <NumberField id="d-tail" label="Tail (V)" name="supply.tail" error={errors.supply?.tail} />
        <NumberField
          id="d-heater"
          label="Heater (V)"
          name="supply.heater"
          placeholder="0"
          error={errors.supply?.heater}
        />
      </div>
      {topology === 'direct-coupled' && (
        <>
          <NumberField
            id="d-g1"
            label="Grid 1 DC (V)"
            name="drive.grid1Dc"
            error={errors.drive?.grid1Dc ?? errors.drive}
          />
          <div className="grid grid-cols-2 gap-2">
            <Field id="d-g2mode" label="Grid 2">
              <select id="d-g2mode" className={inputClass} {...register('drive.grid2.mode')}>
                <option value="leak-to-grid1">Leaks to grid 1</option>
                <option value="fixed">Fixed DC</option>
              </select>
            </Field>
            {grid2Mode === 'fixed' && <NumberField id="d-g2dc" label="Grid 2 DC (V)" name="drive.grid2.dc" />}
          </div>
        </>
      )}
    </div>
  );
}
