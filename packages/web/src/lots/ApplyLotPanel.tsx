import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { ApiError } from '../api/client.js';
import { lotsApi, type LotDetail } from '../api/lotsApi.js';
import { designQueries } from '../api/queries/designQueries.js';
import { Field } from '../components/Field.js';
import { Button, inputClass } from '../components/ui.js';

const PARTS = ['rl1', 'rl2', 'rk', 'rt', 'rg1', 'rg2', 'rload1', 'rload2', 'rsource'] as const;

/**
 * Applies the lot to a design: a resistor lot becomes a part's spread, a tube lot the design's
 * tubes. The server saves a new revision with the lot's values embedded, so runs stay reproducible.
 */
export function ApplyLotPanel({ lot }: { lot: LotDetail }) {
  const qc = useQueryClient();
  const designs = useQuery(designQueries.list(''));
  const [designId, setDesignId] = useState('');
  const [part, setPart] = useState<string>('rk');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const apply = useMutation({
    mutationFn: () => lotsApi.apply(lot.id, designId, lot.kind === 'tube' ? 'tube' : part),
    onSuccess: () => qc.invalidateQueries({ queryKey: designQueries.all }),
    onError: (err) =>
      setErrors(
        err instanceof ApiError && err.field
          ? { [err.field]: err.message }
          : { form: String((err as Error).message) },
      ),
  });
  function submit(e: FormEvent) {
    e.preventDefault();
    setErrors(designId ? {} : { designId: 'Choose a design.' });
    if (designId) apply.mutate();
  }
  const note = (k: string) =>
    errors[k] ? (
      <p className="mt-1 text-xs text-brick" role="alert">
        {errors[k]}
      </p>
    ) : null;
  return (
    <form onSubmit={submit} noValidate aria-label="Apply lot to a design" className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="apply-design" label="Design">
          <select
            id="apply-design"
            className={inputClass}
            value={designId}
            onChange={(e) => setDesignId(e.target.value)}
          >
            <option value="">Choose…</option>
            {designs.data?.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name}
              </option>
            ))}
          </select>
          {note('designId')}
        </Field>
        {lot.kind === 'resistor' ? (
          <Field id="apply-part" label="Part">
            <select
              id="apply-part"
              className={inputClass}
              value={part}
              onChange={(e) => setPart(e.target.value)}
            >
              {PARTS.map((p) => (
                <option key={p} value={p}>
                  {p}
                </option>
              ))}
            </select>
            {note('target')}
          </Field>
        ) : (
          <div className="text-sm text-dim">
            Goes on the design’s {lot.tubeType} tubes: each sample draws one whole tube (both sections) from
            the lot.
            {note('target')}
          </div>
        )}
      </div>
      {note('form')}
      <Button tone="primary" type="submit" disabled={apply.isPending}>
        {apply.isPending ? 'Saving…' : 'Apply as a new revision'}
      </Button>
      {apply.data && (
        <p className="text-sm text-moss" role="status">
          Saved as{' '}
          <Link className="underline" to={`/designs/${apply.data.designId}/revisions/${apply.data.rev}`}>
            revision {apply.data.rev}
          </Link>
          . Runs of it sample this lot.
        </p>
      )}
      {apply.data?.warnings.map((w) => (
        <p key={w} className="rounded-md bg-brass-soft p-2 text-sm text-ink" role="alert">
          Check: {w}.
        </p>
      ))}
    </form>
  );
}
