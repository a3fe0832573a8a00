import { zodResolver } from '@hookform/resolvers/zod';
import { designSchema, migrateDesign, type Design } from '@sigmatail/engine';
import { useState, type ReactNode } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import { ErrorNote } from '../components/QueryState.js';
import { Button, inputClass, Panel } from '../components/ui.js';
import { LiveResults } from './LiveResults.js';
import { PartsTable } from './PartsTable.js';
import { SpecsTable } from './SpecsTable.js';
import { StageFields } from './StageFields.js';
import { StageSchematic } from './StageSchematic.js';
import { TubeFields } from './TubeFields.js';
import { useNominal } from './useNominal.js';
import { withoutUnusedParts } from './withoutUnusedParts.js';

interface DesignFormProps {
  initial: Design;
  readOnly: boolean;
  /** Save handler; absent for read-only views. `message` describes the revision. */
  onSave?: (document: Design, message: string) => Promise<void>;
  saveLabel?: string;
  /** Shown above the form's save bar (e.g. why it is read-only). */
  banner?: ReactNode;
}

/**
 * The design editor: react-hook-form validated by the engine's own design schema, with the
 * nominal results and the schematic recomputed by the engine in the browser as values change.
 */
export function DesignForm({
  initial,
  readOnly,
  onSave,
  saveLabel = 'Save revision',
  banner,
}: DesignFormProps) {
  const form = useForm<Design>({
    resolver: zodResolver(designSchema),
    // Older document versions open migrated, so they validate and save as the current version.
    defaultValues: migrateDesign(initial) as Design,
    mode: 'onChange',
  });
  const [message, setMessage] = useState('');
  const [saveError, setSaveError] = useState<unknown>(null);
  const live = useNominal(form.watch());
  const submit = form.handleSubmit(async (edited) => {
    setSaveError(null);
    const doc = withoutUnusedParts(edited);
    try {
      await onSave?.(doc, message);
      form.reset(doc);
      setMessage('');
    } catch (e) {
      setSaveError(e);
    }
  });
  return (
    <FormProvider {...form}>
      <div className="grid gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(340px,2fr)]">
        <form onSubmit={submit} noValidate aria-label="Design editor" className="min-w-0">
          {banner}
          {!readOnly && onSave && (
            <div className="no-print sticky top-0 z-10 mb-4 flex flex-wrap items-center gap-3 rounded-lg border border-rule bg-sheet/95 p-3 backdrop-blur">
              <label htmlFor="rev-message" className="sr-only">
                Revision note
              </label>
              <input
                id="rev-message"
                placeholder="What changed? (optional)"
                className={`${inputClass} max-w-md flex-1`}
                value={message}
                onChange={(e) => setMessage(e.target.value)}
              />
              <Button tone="primary" type="submit" disabled={form.formState.isSubmitting}>
                {form.formState.isSubmitting ? 'Saving…' : saveLabel}
              </Button>
              {form.formState.isDirty && <span className="text-xs text-brass">Unsaved changes</span>}
              {form.formState.submitCount > 0 && !form.formState.isValid && (
                <span role="alert" className="text-xs text-brick">
                  Some fields need attention (marked in red).
                </span>
              )}
            </div>
          )}
          <fieldset disabled={readOnly} className="space-y-4">
            <Panel title="Stage">
              <StageFields />
            </Panel>
            <Panel title="Parts">
              <PartsTable readOnly={readOnly} />
            </Panel>
            <Panel title="Tube">
              <TubeFields />
            </Panel>
            <Panel title="Specs">
              <SpecsTable readOnly={readOnly} />
            </Panel>
          </fieldset>
          {saveError !== null && (
            <div className="mt-3">
              <ErrorNote error={saveError} />
            </div>
          )}
        </form>
        <div className="space-y-4 xl:sticky xl:top-4 xl:self-start">
          <LiveResults state={live} />
          {live.ok && live.design.topology !== 'split-load' && (
            <Panel title="Schematic">
              <StageSchematic design={live.design} report={live.report} />
            </Panel>
          )}
        </div>
      </div>
    </FormProvider>
  );
}
