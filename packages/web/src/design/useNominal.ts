import { useDeferredValue, useMemo } from 'react';
import { nominalResults, parseDesign, type NominalReport, type ResolvedDesign } from '@sigmatail/engine';

export type NominalState =
  | { ok: true; design: ResolvedDesign; report: NominalReport }
  | { ok: false; errors: { path: string; message: string }[] };

/** Parse the form's document with the engine and evaluate it at nominal, deferred behind typing. */
export function useNominal(document: unknown): NominalState {
  const key = JSON.stringify(document);
  const deferred = useDeferredValue(key);
  return useMemo(() => evaluateNominal(JSON.parse(deferred) as unknown), [deferred]);
}

export function evaluateNominal(document: unknown): NominalState {
  const parsed = parseDesign(document);
  if (!parsed.ok) return { ok: false, errors: parsed.errors };
  try {
    return { ok: true, design: parsed.design, report: nominalResults(parsed.design) };
  } catch (e) {
    // The engine should never throw on a valid design; if it does, show it rather than blank the page.
    return { ok: false, errors: [{ path: '(engine)', message: e instanceof Error ? e.message : String(e) }] };
  }
}
