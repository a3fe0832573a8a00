/** How many runs a comparison shows at the most. */
export const MAX_PICKED_RUNS = 4;

/** The picked run ids after ticking (`on`) or unticking `id`; a tick past the limit drops the oldest pick. */
export function togglePick(picked: readonly string[], id: string, on: boolean): string[] {
  return on ? [...picked, id].slice(-MAX_PICKED_RUNS) : picked.filter((x) => x !== id);
}
