import { engineJob } from './engineJob.js';
import { createTaskHandler } from './taskHandler.js';

/** The pool thread file: runs engine chunks, once-per-run extras and merges. */
export default createTaskHandler(engineJob);
