import { Kysely, sql } from 'kysely';

// Designs, their immutable revisions, stored files and the activity log.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('designs')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('shop_id', 'uuid', (c) => c.notNull().references('shops.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('insert', 'jig', 'template')`))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('description', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('tags', sql`text[]`, (c) => c.notNull().defaultTo(sql`'{}'::text[]`))
    .addColumn('material', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('forked_from_design_id', 'uuid', (c) => c.references('designs.id').onDelete('set null'))
    .addColumn('forked_from_revision_id', 'uuid')
    .addColumn('latest_revision_number', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('latest_status', 'text', (c) => c.notNull().defaultTo('draft'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // array_to_string is only STABLE; wrapped as IMMUTABLE (true for text[]) so it can feed a generated column.
  await sql`CREATE FUNCTION jw_tags_text(text[]) RETURNS text LANGUAGE sql IMMUTABLE PARALLEL SAFE
      AS $$ SELECT array_to_string($1, ' ') $$`.execute(db);
  await sql`ALTER TABLE designs ADD COLUMN search tsvector GENERATED ALWAYS AS (
      setweight(to_tsvector('simple', coalesce(title, '')), 'A') ||
      setweight(to_tsvector('simple', jw_tags_text(tags)), 'B') ||
      setweight(to_tsvector('simple', coalesce(description, '')), 'C')) STORED`.execute(db);
  await sql`CREATE INDEX designs_search_idx ON designs USING gin (search)`.execute(db);
  await sql`CREATE INDEX designs_tags_idx ON designs USING gin (tags)`.execute(db);
  await sql`CREATE INDEX designs_shop_updated_idx ON designs (shop_id, updated_at DESC, id DESC)`.execute(db);
  await sql`CREATE INDEX designs_shop_title_idx ON designs (shop_id, lower(title), id)`.execute(db);
  await sql`CREATE INDEX designs_forked_from_idx ON designs (forked_from_design_id)`.execute(db);

  await db.schema
    .createTable('revisions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('design_id', 'uuid', (c) => c.notNull().references('designs.id').onDelete('cascade'))
    .addColumn('number', 'integer', (c) => c.notNull().check(sql`number > 0`))
    .addColumn('message', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('source', 'text', (c) => c.notNull().check(sql`source in ('generated', 'uploaded')`))
    .addColumn('generator_id', 'text')
    .addColumn('params', 'jsonb')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('draft').check(sql`status in ('draft', 'trial', 'proven', 'retired')`))
    .addColumn('fit_notes', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('summary', 'jsonb', (c) => c.notNull())
    .addColumn('units', 'text', (c) => c.notNull().defaultTo('mm').check(sql`units in ('mm', 'in')`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('revisions_design_number_uq', ['design_id', 'number'])
    .execute();
  await sql`ALTER TABLE designs ADD CONSTRAINT designs_forked_from_revision_fk
      FOREIGN KEY (forked_from_revision_id) REFERENCES revisions(id) ON DELETE SET NULL`.execute(db);

  // A saved revision never changes: only its status may move along its life.
  await sql`CREATE FUNCTION revisions_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF (to_jsonb(NEW) - 'status') IS DISTINCT FROM (to_jsonb(OLD) - 'status') THEN
        RAISE EXCEPTION 'revisions are immutable; save a new revision instead' USING ERRCODE = 'P0001';
      END IF;
      RETURN NEW;
    END $$`.execute(db);
  await sql`CREATE TRIGGER revisions_immutable_trg BEFORE UPDATE ON revisions
      FOR EACH ROW EXECUTE FUNCTION revisions_immutable()`.execute(db);

  await db.schema
    .createTable('revision_files')
    .addColumn('revision_id', 'uuid', (c) => c.notNull().references('revisions.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('original', 'dxf', 'dxf_in', 'svg', 'model')`))
    .addColumn('object_key', 'text', (c) => c.notNull().unique())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('bytes', 'integer', (c) => c.notNull())
    .addColumn('sha256', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('revision_files_pk', ['revision_id', 'role'])
    .execute();

  await db.schema
    .createTable('activity')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('shop_id', 'uuid', (c) => c.notNull().references('shops.id').onDelete('cascade'))
    .addColumn('design_id', 'uuid', (c) => c.references('designs.id').onDelete('cascade'))
    .addColumn('revision_id', 'uuid', (c) => c.references('revisions.id').onDelete('cascade'))
    .addColumn('actor_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('detail', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`CREATE INDEX activity_design_idx ON activity (design_id, id DESC)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('activity').ifExists().execute();
  await db.schema.dropTable('revision_files').ifExists().execute();
  await sql`ALTER TABLE designs DROP CONSTRAINT IF EXISTS designs_forked_from_revision_fk`.execute(db);
  await db.schema.dropTable('revisions').ifExists().execute();
  await sql`DROP FUNCTION IF EXISTS revisions_immutable()`.execute(db);
  await db.schema.dropTable('designs').ifExists().execute();
  await sql`DROP FUNCTION IF EXISTS jw_tags_text(text[])`.execute(db);
}
