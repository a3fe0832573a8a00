import { studyJob } from './studyJob.js';

/** The study pool's thread file. */
export default studyJob;
