import { createTaskHandler } from '../taskHandler.js';
import { fakeJob } from './fakeJob.js';

/** Pool thread file running the fake job (tests only). */
export default createTaskHandler(fakeJob);
