import { SPLIT_LOAD_UNUSED_PARTS, type Design } from '@sigmatail/engine';

/**
 * The document as saved: a split-load design without the parts it does not use (RL2 and RG2 of a
 * second section, the grid-2 bypass Cg2), which the editor keeps while the topology may still
 * change back to a long-tailed pair but does not show. Other topologies are returned as they are.
 *
 * @example
 * withoutUnusedParts({ ...doc, topology: 'split-load' }).parts.rl2; // undefined
 */
export function withoutUnusedParts(doc: Design): Design {
  if (doc.topology !== 'split-load') return doc;
  const parts = { ...doc.parts };
  for (const name of SPLIT_LOAD_UNUSED_PARTS) delete parts[name];
  return { ...doc, parts };
}
