import { useQuery } from '@tanstack/react-query';
import { designQueries } from '../api/queries/designQueries.js';
import { Field } from '../components/Field.js';
import { inputClass } from '../components/ui.js';

/** Choose one of the workspace's designs (its latest revision is studied). */
export function DesignPicker({
  id,
  value,
  onChange,
  error,
}: {
  id: string;
  value: string;
  onChange: (designId: string) => void;
  error?: string | null;
}) {
  const designs = useQuery(designQueries.list(''));
  return (
    <Field id={id} label="Design (latest revision)">
      <select
        id={id}
        className={inputClass}
        value={value}
        aria-invalid={!!error}
        onChange={(e) => onChange(e.target.value)}
      >
        <option value="">{designs.isPending ? 'Loading designs…' : 'Choose a design'}</option>
        {designs.data?.map((d) => (
          <option key={d.id} value={d.id}>
            {d.name} (rev {d.latestRev})
          </option>
        ))}
      </select>
      {error && <p className="mt-0.5 text-xs text-brick">{error}</p>}
    </Field>
  );
}
