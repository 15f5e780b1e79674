import fs from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Migrator, type Migration, type MigrationProvider, type Kysely } from 'kysely';

const migrationsDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

// Kysely's FileMigrationProvider trips over .ts files under vitest; importing each file by its
// URL works under tsx, vitest and plain node alike.
class UrlMigrationProvider implements MigrationProvider {
  async getMigrations(): Promise<Record<string, Migration>> {
    const files = (await fs.readdir(migrationsDir)).filter((f) => /^\d{4}_.+\.ts$/.test(f)).sort();
    const out: Record<string, Migration> = {};
    for (const f of files) {
      out[f.replace(/\.ts$/, '')] = await import(pathToFileURL(path.join(migrationsDir, f)).href);
    }
    return out;
  }
}

export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const migrator = new Migrator({ db, provider: new UrlMigrationProvider() });
  const { error, results } = await migrator.migrateToLatest();
  if (error) {
    const failed = results?.find((r) => r.status === 'Error');
    throw new Error(`migration ${failed?.migrationName ?? '?'} failed: ${(error as Error).message ?? error}`);
  }
  return (results ?? []).filter((r) => r.status === 'Success').map((r) => r.migrationName);
}
