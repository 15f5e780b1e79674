import { Kysely, sql } from 'kysely';

// Shop archives (server/archive): what an import keeps that has no row of its own here.
// - designs.forked_from_text: lineage to a design outside the archive, as words ("Bedside plate r2
//   (Larchmere Workshop)"); imported forks never point at another shop's rows.
// - designs/revisions/cut_logs.author_name, activity.actor_name: who made it, when that person has
//   no account in the importing shop.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE designs ADD COLUMN forked_from_text text`.execute(db);
  await sql`ALTER TABLE designs ADD COLUMN author_name text`.execute(db);
  await sql`ALTER TABLE revisions ADD COLUMN author_name text`.execute(db);
  await sql`ALTER TABLE cut_logs ADD COLUMN author_name text`.execute(db);
  await sql`ALTER TABLE activity ADD COLUMN actor_name text`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE activity DROP COLUMN IF EXISTS actor_name`.execute(db);
  await sql`ALTER TABLE cut_logs DROP COLUMN IF EXISTS author_name`.execute(db);
  await sql`ALTER TABLE designs DROP COLUMN IF EXISTS author_name`.execute(db);
  await sql`ALTER TABLE revisions DROP COLUMN IF EXISTS author_name`.execute(db);
  await sql`ALTER TABLE designs DROP COLUMN IF EXISTS forked_from_text`.execute(db);
}
