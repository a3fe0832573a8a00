import { useFormContext } from 'react-hook-form';
import type { Design } from '@sigmatail/engine';
import { inputClass, labelClass } from '../components/ui.js';
import { FieldError, optionalNumber } from './formHelpers.js';

/** Name, topology, supplies and (direct-coupled) grid drive. */
export function StageFields() {
  const {
    register,
    watch,
    formState: { errors },
  } = useFormContext<Design>();
  const topology = watch('topology');
  const grid2Mode = watch('drive.grid2.mode');
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <label htmlFor="d-name" className={labelClass}>
          Design name
        </label>
        <input id="d-name" className={inputClass} {...register('name')} />
        <FieldError error={errors.name} />
      </div>
      <div className="sm:col-span-2">
        <label htmlFor="d-notes" className={labelClass}>
          Notes
        </label>
        <textarea id="d-notes" rows={2} className={inputClass} {...register('notes')} />
      </div>
      <div>
        <label htmlFor="d-topology" className={labelClass}>
          Topology
        </label>
        <select id="d-topology" className={inputClass} {...register('topology')}>
          <option value="cap-coupled">Capacitor-coupled (grids leak to J)</option>
          <option value="direct-coupled">Direct-coupled (grid 1 at a DC level)</option>
        </select>
      </div>
      <div className="grid grid-cols-3 gap-2">
        <div>
          <label htmlFor="d-bplus" className={labelClass}>
            B+ (V)
          </label>
          <input
            id="d-bplus"
            type="number"
            step="any"
            className={`${inputClass} num`}
            {...register('supply.bPlus', optionalNumber)}
          />
          <FieldError error={errors.supply?.bPlus} />
        </div>
        <div>
          <label htmlFor="d-tail" className={labelClass}>
            Tail (V)
          </label>
          <input
            id="d-tail"
            type="number"
            step="any"
            className={`${inputClass} num`}
            {...register('supply.tail', optionalNumber)}
          />
          <FieldError error={errors.supply?.tail} />
        </div>
        <div>
          <label htmlFor="d-heater" className={labelClass}>
            Heater (V)
          </label>
          <input
            id="d-heater"
            type="number"
            step="any"
            placeholder="0"
            className={`${inputClass} num`}
            {...register('supply.heater', optionalNumber)}
          />
          <FieldError error={errors.supply?.heater} />
        </div>
      </div>
      {topology === 'direct-coupled' && (
        <>
          <div>
            <label htmlFor="d-g1" className={labelClass}>
              Grid 1 DC (V)
            </label>
            <input
              id="d-g1"
              type="number"
              step="any"
              className={`${inputClass} num`}
              {...register('drive.grid1Dc', optionalNumber)}
            />
            <FieldError error={errors.drive?.grid1Dc ?? errors.drive} />
          </div>
          <div className="grid grid-cols-2 gap-2">
            <div>
              <label htmlFor="d-g2mode" className={labelClass}>
                Grid 2
              </label>
              <select id="d-g2mode" className={inputClass} {...register('drive.grid2.mode')}>
                <option value="leak-to-grid1">Leaks to grid 1</option>
                <option value="fixed">Fixed DC</option>
              </select>
            </div>
            {grid2Mode === 'fixed' && (
              <div>
                <label htmlFor="d-g2dc" className={labelClass}>
                  Grid 2 DC (V)
                </label>
                <input
                  id="d-g2dc"
                  type="number"
                  step="any"
                  className={`${inputClass} num`}
                  {...register('drive.grid2.dc', optionalNumber)}
                />
              </div>
            )}
          </div>
        </>
      )}
    </div>
  );
}
