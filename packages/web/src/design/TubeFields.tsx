import { useFormContext } from 'react-hook-form';
import { TUBE_CATALOG, TUBE_TYPES, type Design } from '@sigmatail/engine';
import { inputClass, labelClass } from '../components/ui.js';
import { formatSi } from '../format/formatSi.js';
import { FieldError, optionalNumber } from './formHelpers.js';

/** Tube type, spread between envelopes and sections, and the pairing rule. */
export function TubeFields() {
  const {
    register,
    watch,
    setValue,
    formState: { errors },
  } = useFormContext<Design>();
  const type = watch('tube.type');
  const pairing = watch('tube.spread.pairing');
  const spec = TUBE_CATALOG[type];
  const e = errors.tube?.spread;
  return (
    <div className="grid gap-3 sm:grid-cols-4">
      <div className="sm:col-span-2">
        <label htmlFor="t-type" className={labelClass}>
          Tube type
        </label>
        <select id="t-type" className={inputClass} {...register('tube.type')}>
          {TUBE_TYPES.map((t) => (
            <option key={t}>{t}</option>
          ))}
        </select>
        {spec && (
          <p className="num mt-1 text-xs text-dim">
            mu {spec.typical.mu} · gm {formatSi(spec.typical.gm, 'S')} · rp {formatSi(spec.typical.rp, 'Ω')} ·
            Pd max {spec.maxPlateDissipation.value} W
          </p>
        )}
      </div>
      <div>
        <label htmlFor="t-perv" className={labelClass}>
          Perveance spread (% 1σ)
        </label>
        <input
          id="t-perv"
          type="number"
          step="any"
          className={`${inputClass} num`}
          {...register('tube.spread.perveanceSd', optionalNumber)}
        />
        <FieldError error={e?.perveanceSd} />
      </div>
      <div>
        <label htmlFor="t-mu" className={labelClass}>
          mu spread (% 1σ)
        </label>
        <input
          id="t-mu"
          type="number"
          step="any"
          className={`${inputClass} num`}
          {...register('tube.spread.muSd', optionalNumber)}
        />
        <FieldError error={e?.muSd} />
      </div>
      <div>
        <label htmlFor="t-corr" className={labelClass}>
          Section correlation (0–1)
        </label>
        <input
          id="t-corr"
          type="number"
          step="0.05"
          min={0}
          max={1}
          className={`${inputClass} num`}
          {...register('tube.spread.sectionCorrelation', optionalNumber)}
        />
        <FieldError error={e?.sectionCorrelation} />
      </div>
      <div>
        <label htmlFor="t-pair" className={labelClass}>
          Pairing rule
        </label>
        <select
          id="t-pair"
          className={inputClass}
          value={pairing?.quantity ?? 'none'}
          onChange={(ev) => {
            const q = ev.target.value;
            setValue(
              'tube.spread.pairing',
              q === 'none' ? undefined : { quantity: q as 'ia' | 'gm' | 'mu', within: pairing?.within ?? 10 },
              {
                shouldDirty: true,
                shouldValidate: true,
              },
            );
          }}
        >
          <option value="none">Unpaired</option>
          <option value="ia">Matched on plate current</option>
          <option value="gm">Matched on gm</option>
          <option value="mu">Matched on mu</option>
        </select>
      </div>
      {pairing && (
        <div>
          <label htmlFor="t-within" className={labelClass}>
            Matched within ± %
          </label>
          <input
            id="t-within"
            type="number"
            step="any"
            className={`${inputClass} num`}
            {...register('tube.spread.pairing.within', optionalNumber)}
          />
          <FieldError error={e?.pairing?.within} />
        </div>
      )}
    </div>
  );
}
