// Worker process entry: DATABASE_URL (shared database), SIGMATAIL_WORKER_THREADS (default: cores).
import { runWorkerProcess } from './workerProcess.js';

await runWorkerProcess({ env: process.env });
