import { runWorkerProcess } from '../workerProcess.js';

const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
/** A worker process running the fake job (tests only). */
await runWorkerProcess({ env: process.env, taskUrl: new URL(`./fakeChunkTask${ext}`, import.meta.url) });
