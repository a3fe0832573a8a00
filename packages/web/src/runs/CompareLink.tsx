import { Link } from 'react-router';
import { MAX_PICKED_RUNS } from './togglePick.js';

/** A panel action: the link comparing the picked runs once two or more are picked, else how to pick them. */
export function CompareLink({ picked }: { picked: readonly string[] }) {
  return picked.length >= 2 && picked.length <= MAX_PICKED_RUNS ? (
    <Link
      to={`/compare?runs=${picked.join(',')}`}
      className="rounded-md bg-glow px-3 py-1.5 text-sm font-medium text-white"
    >
      Compare {picked.length} runs
    </Link>
  ) : (
    <span className="text-xs text-dim">Pick 2–{MAX_PICKED_RUNS} runs to compare</span>
  );
}
