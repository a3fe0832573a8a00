import pg from 'pg';

interface Listener {
  channel: string;
  onMessage: (payload: string) => void;
  /** Called when the connection drops (notifications may have been missed) and when it is back. */
  onState: (connected: boolean) => void;
}

interface HandleState {
  url: string;
  listeners: Listener[];
  client: pg.Client | null;
  connected: boolean;
  closed: boolean;
  retry: NodeJS.Timeout | null;
}

const handles = new WeakMap<object, HandleState>();

/** createDb records its URL so listeners can open their own connection (LISTEN needs one held open). */
export function registerDatabaseUrl(db: object, url: string): void {
  handles.set(db, { url, listeners: [], client: null, connected: false, closed: false, retry: null });
}

/**
 * Calls onMessage for every NOTIFY on `channel` (sent by any process on the same database), over
 * one dedicated connection per database handle that reconnects after a drop. onState(false) says
 * notifications may be missed until onState(true); users of this must not trust cached state then.
 */
export function listenForNotifications(db: object, listener: Listener): void {
  const state = handles.get(db);
  if (!state) throw new Error('listenForNotifications needs a handle made by createDb');
  state.listeners.push(listener);
  if (state.connected && state.client) {
    state.client.query(`listen "${listener.channel}"`).then(
      () => listener.onState(true),
      () => undefined,
    );
  } else if (!state.client && !state.retry) {
    connect(state);
  }
}

function connect(state: HandleState): void {
  state.retry = null;
  if (state.closed) return;
  const client = new pg.Client({ connectionString: state.url, connectionTimeoutMillis: 2_000 });
  state.client = client;
  const drop = (): void => {
    if (state.client !== client) return;
    state.client = null;
    if (state.connected) for (const l of state.listeners) l.onState(false);
    state.connected = false;
    client.end().catch(() => undefined);
    if (!state.closed) state.retry = setTimeout(() => connect(state), 1_000).unref();
  };
  client.on('error', drop);
  client.on('end', drop);
  client.on('notification', (msg) => {
    for (const l of state.listeners) if (l.channel === msg.channel) l.onMessage(msg.payload ?? '');
  });
  client
    .connect()
    .then(async () => {
      const channels = [...new Set(state.listeners.map((l) => l.channel))];
      for (const ch of channels) await client.query(`listen "${ch}"`);
      if (state.client !== client) return;
      state.connected = true;
      for (const l of state.listeners) l.onState(true);
    })
    .catch(drop);
}

/** Closes the LISTEN connection of a handle (db.destroy() calls this). */
export async function closeListeners(db: object): Promise<void> {
  const state = handles.get(db);
  if (!state) return;
  state.closed = true;
  if (state.retry) clearTimeout(state.retry);
  const client = state.client;
  state.client = null;
  state.connected = false;
  if (client) await client.end().catch(() => undefined);
}
