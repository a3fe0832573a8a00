import { promises as fs } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Migration, MigrationProvider } from 'kysely';

/** The migrations folder beside this module (src/migrations from source, dist/migrations when built). */
export const MIGRATIONS_DIR = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

/**
 * Loads migrations with an import() from our own source, so vitest, tsx and plain node all transform
 * or resolve the files (Kysely's FileMigrationProvider imports from node_modules, which vitest skips).
 * Names drop the extension, so .ts in dev and .js in dist are the same rows in kysely_migration.
 */
export class DirMigrationProvider implements MigrationProvider {
  constructor(private readonly dir: string = MIGRATIONS_DIR) {}

  async getMigrations(): Promise<Record<string, Migration>> {
    const out: Record<string, Migration> = {};
    for (const file of (await fs.readdir(this.dir)).sort()) {
      if (!/\.(m?ts|m?js)$/.test(file) || /\.d\.m?ts$/.test(file) || /\.test\./.test(file)) continue;
      out[file.replace(/\.[^.]+$/, '')] = (await import(
        pathToFileURL(path.join(this.dir, file)).href
      )) as Migration;
    }
    return out;
  }
}
