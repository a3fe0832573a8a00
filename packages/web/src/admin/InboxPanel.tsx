import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { adminQueries } from '../api/queries/adminQueries.js';
import { ErrorNote, Loading, QueryStatus } from '../components/QueryState.js';
import { Button, Panel } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';

/** Mail captured by the local SMTP fake (development and tests only). */
export function InboxPanel() {
  // Mail is sent after the request that causes it answers, so keep looking for a while.
  const inbox = useQuery({ ...adminQueries.inbox(), refetchInterval: 3000 });
  const [open, setOpen] = useState<string | null>(null);
  const message = useQuery({ ...adminQueries.inboxMessage(open ?? ''), enabled: open !== null });
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
      <Panel title="Dev inbox" actions={<Button onClick={() => inbox.refetch()}>Refresh</Button>}>
        <QueryStatus query={inbox} />
        {inbox.data?.length === 0 && <p className="text-sm text-dim">No mail captured yet.</p>}
        <ul className="divide-y divide-rule/70" aria-label="Captured mail">
          {inbox.data?.map((m) => (
            <li key={m.id}>
              <button
                type="button"
                onClick={() => setOpen(m.id)}
                className={`w-full px-2 py-2 text-left text-sm hover:bg-petrol-soft ${open === m.id ? 'bg-petrol-soft' : ''}`}
              >
                <span className="block font-medium">{m.subject}</span>
                <span className="block text-xs text-dim">
                  to {m.to} · {formatWhen(m.receivedAt)}
                </span>
              </button>
            </li>
          ))}
        </ul>
      </Panel>
      <Panel title="Message">
        {open === null && <p className="text-sm text-dim">Pick a message to read it.</p>}
        {open !== null && message.isPending && <Loading />}
        {message.isError && <ErrorNote error={message.error} />}
        {message.data && (
          <article className="space-y-2 text-sm" aria-label="Message body">
            <h3 className="font-semibold">{message.data.subject}</h3>
            <p className="text-xs text-dim">
              from {message.data.from ?? '—'} to {message.data.to}
            </p>
            <pre className="num overflow-x-auto rounded bg-paper p-3 text-xs whitespace-pre-wrap">
              {message.data.text}
            </pre>
          </article>
        )}
      </Panel>
    </div>
  );
}
