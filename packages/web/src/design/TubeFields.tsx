import { useFormContext } from 'react-hook-form';
import { TUBE_CATALOG, TUBE_TYPES, type Design } from '@sigmatail/engine';
import { Field } from '../components/Field.js';
import { inputClass } from '../components/ui.js';
import { formatSi } from '../format/formatSi.js';
import { NumberField } from './NumberField.js';

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
  const lot = watch('tube.spread.lot');
  const spec = TUBE_CATALOG[type];
  const e = errors.tube?.spread;
  return (
    <div className="grid gap-3 sm:grid-cols-4">
      <Field id="t-type" label="Tube type" className="sm:col-span-2">
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
      </Field>
      <NumberField
        id="t-perv"
        label="Perveance spread (% 1σ)"
        name="tube.spread.perveanceSd"
        error={e?.perveanceSd}
      />
      <NumberField id="t-mu" label="mu spread (% 1σ)" name="tube.spread.muSd" error={e?.muSd} />
      <NumberField
        id="t-corr"
        label="Section correlation (0–1)"
        name="tube.spread.sectionCorrelation"
        step="0.05"
        min={0}
        max={1}
        error={e?.sectionCorrelation}
      />
      <Field id="t-pair" label="Pairing rule">
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
      </Field>
      {lot && (
        <p className="text-sm sm:col-span-4" data-testid="tube-lot">
          Tubes drawn whole from the measured lot <strong>{lot.name}</strong> ({lot.tubes.length} tubes): the
          perveance and mu spreads and the section correlation above are not used.{' '}
          <button
            type="button"
            className="text-glow underline"
            onClick={() => setValue('tube.spread.lot', undefined, { shouldDirty: true })}
          >
            Use the spread figures instead
          </button>
        </p>
      )}
      {pairing && (
        <NumberField
          id="t-within"
          label="Matched within ± %"
          name="tube.spread.pairing.within"
          error={e?.pairing?.within}
        />
      )}
    </div>
  );
}
