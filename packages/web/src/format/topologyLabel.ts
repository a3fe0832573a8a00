const TOPOLOGY_LABEL: Record<string, string> = {
  'cap-coupled': 'Long-tailed pair, capacitor-coupled',
  'direct-coupled': 'Long-tailed pair, direct-coupled',
  'split-load': 'Split-load (cathodyne)',
};

/**
 * The reader's name of a design document's topology; an unknown one is shown as stored.
 *
 * @example topologyLabel('split-load') // 'Split-load (cathodyne)'
 */
export function topologyLabel(topology: string | null | undefined): string {
  if (!topology) return '–';
  return TOPOLOGY_LABEL[topology] ?? topology;
}
