const TONE: Record<string, string> = {
  queued: 'bg-petrol-soft text-petrol',
  running: 'bg-glow-soft text-glow',
  merging: 'bg-glow-soft text-glow',
  done: 'bg-moss-soft text-moss',
  failed: 'bg-brick-soft text-brick',
  cancelled: 'bg-paper text-dim',
};

export function RunStatusBadge({ status }: { status: string }) {
  return (
    <span className={`rounded px-2 py-0.5 text-xs font-medium ${TONE[status] ?? 'bg-paper text-dim'}`}>
      {status}
    </span>
  );
}
