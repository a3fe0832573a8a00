import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '../api/client.js';
import { ErrorNote } from '../components/QueryState.js';
import { TextField } from '../components/TextField.js';
import { Button, Panel } from '../components/ui.js';

/** Mails the production report of a design to a colleague (the server gathers and sends it). */
export function ReportEmailForm({ designId }: { designId: string }) {
  const [to, setTo] = useState('');
  const [note, setNote] = useState('');
  const send = useMutation({ mutationFn: () => api.reports.email(designId, to, note.trim() || undefined) });
  return (
    <Panel title="E-mail this report" className="no-print">
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          send.mutate();
        }}
      >
        <TextField
          id="report-to"
          label="Colleague's e-mail"
          className="min-w-64 flex-1"
          type="email"
          required
          value={to}
          onChange={(e) => setTo(e.target.value)}
        />
        <TextField
          id="report-note"
          label="Note (optional)"
          className="min-w-64 flex-[2]"
          maxLength={2000}
          value={note}
          onChange={(e) => setNote(e.target.value)}
        />
        <Button tone="primary" type="submit" disabled={send.isPending}>
          Send report
        </Button>
      </form>
      {send.isError && (
        <div className="mt-3">
          <ErrorNote error={send.error} />
        </div>
      )}
      {send.isSuccess && (
        <p role="status" className="mt-3 text-sm text-moss">
          Report sent to {send.data.to}. In development it lands in the admin's Dev inbox.
        </p>
      )}
    </Panel>
  );
}
