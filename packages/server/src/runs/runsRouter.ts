import { Router } from 'express';

/** Runs API (designs' runs, queue, results, export). Filled in by the runs work; mounted under /api. */
export function createRunsRouter(_deps: unknown): Router {
  return Router();
}
