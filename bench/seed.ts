// The bench library: 10 000 invented designs with 10 revisions each (100 000 revisions), written
// in bulk by INSERT … SELECT generate_series. Ids are md5-derived, so runs are repeatable. Titles,
// tags, materials and descriptions come from invented word lists. No objects are written: the
// library list reads rows only.
import { sql } from 'kysely';
import type { DB } from '../db/connect';

export const BENCH_DESIGNS = 10_000;
export const REVISIONS_PER_DESIGN = 10;

const WOODS = ['walnut', 'birch', 'oak', 'maple', 'ash', 'cherry', 'beech', 'poplar'];
const THINGS = ['charger insert', 'taper sled', 'dock template', 'half-lap template', 'cord channel jig', 'hinge mortise template', 'shelf pin jig', 'pull template', 'grommet template', 'dowel jig', 'tray pocket template'];
const PLACES = ['bedside table', 'desk', 'bookshelf', 'kitchen island', 'sideboard', 'workbench', 'hall console'];
const TAGS = ['charger', 'cord', 'bedside', 'desk', 'shelf', 'drawer', 'hinge', 'dock', 'kitchen', 'office', 'tray', 'lamp'];
const MATERIALS = ['Birch ply', 'Walnut', 'White oak', 'MDF', 'Maple', 'Baltic ply', 'Ash'];
const STATUSES = ['draft', 'trial', 'proven', 'retired'];

const arr = (xs: string[]) => sql.raw(`(ARRAY[${xs.map((x) => `'${x.replace(/'/g, "''")}'`).join(',')}]::text[])`);

/** Seeds the library into `shopId`, authored by `authorId`. Returns the counts written. */
export async function seedBenchLibrary(db: DB, shopId: string, authorId: string): Promise<{ designs: number; revisions: number }> {
  const n = BENCH_DESIGNS;
  const k = REVISIONS_PER_DESIGN;
  // Pick from a list by a multiplicative hash of i, so neighbours differ: list[1 + (i*m) % len].
  await sql`
    INSERT INTO designs (id, shop_id, kind, title, description, tags, material, author_id,
                         forked_from_design_id, latest_revision_number, latest_status, created_at, updated_at)
    SELECT md5('jw-bench-design-' || i)::uuid,
           ${shopId}::uuid,
           (ARRAY['insert','jig','template'])[1 + i % 3],
           initcap(w.wood) || ' ' || t.thing || ' for the ' || p.place || ' no. ' || i,
           'A ' || t.thing || ' cut in ' || w.wood || ' for the ' || p.place || '. Tried on a plywood test piece first; fit notes on each revision.',
           ARRAY[${arr(TAGS)}[1 + (i * 7) % ${TAGS.length}], ${arr(TAGS)}[1 + (i * 11 + 3) % ${TAGS.length}]],
           ${arr(MATERIALS)}[1 + (i * 5) % ${MATERIALS.length}],
           ${authorId}::uuid,
           CASE WHEN i % 20 = 0 THEN md5('jw-bench-design-' || (i - 1))::uuid END,
           ${k}::int,
           ${arr(STATUSES)}[1 + (i * 3) % ${STATUSES.length}],
           now() - make_interval(mins => i * 53 + 60 * 24 * 30),
           now() - make_interval(mins => i * 37)
    FROM generate_series(1, ${n}) AS i
    CROSS JOIN LATERAL (SELECT ${arr(WOODS)}[1 + (i * 13) % ${WOODS.length}] AS wood) w
    CROSS JOIN LATERAL (SELECT ${arr(THINGS)}[1 + (i * 17) % ${THINGS.length}] AS thing) t
    CROSS JOIN LATERAL (SELECT ${arr(PLACES)}[1 + (i * 19) % ${PLACES.length}] AS place) p
  `.execute(db);

  await sql`
    INSERT INTO revisions (id, design_id, number, message, author_id, source, generator_id, params, status, fit_notes, summary, created_at)
    SELECT md5('jw-bench-rev-' || i || '-' || r)::uuid,
           md5('jw-bench-design-' || i)::uuid,
           r,
           'Revision ' || r || ': clearance ' || (0.2 + (r % 4) * 0.1)::text || ' mm per side',
           ${authorId}::uuid,
           CASE WHEN i % 3 = 1 THEN 'generated' ELSE 'uploaded' END,
           CASE WHEN i % 3 = 1 THEN 'charger-insert' END,
           CASE WHEN i % 3 = 1 THEN jsonb_build_object('openingWidth', 120 + r, 'openingLength', 200, 'fitClearance', 0.4) END,
           CASE WHEN r = ${k} THEN ${arr(STATUSES)}[1 + (i * 3) % ${STATUSES.length}] ELSE 'retired' END,
           jsonb_build_object('clearancePerSide', 0.2 + (r % 4) * 0.1, 'text', 'Bench fit note ' || r),
           jsonb_build_object(
             'units', 'mm',
             'extents', jsonb_build_object('minX', 0, 'minY', 0, 'maxX', 119 + r, 'maxY', 199, 'width', 119 + r, 'height', 199),
             'area', (119 + r) * 199 - 12000,
             'perimeter', 2 * (119 + r + 199) + 900,
             'closedContours', 4, 'openContours', 0,
             'layers', jsonb_build_object('outline', 8, 'pocket', 8, 'recess', 1, 'channel', 4),
             'features', jsonb_build_object('pocket', jsonb_build_object('width', 80.6, 'height', 165, 'depth', 3))),
           now() - make_interval(mins => i * 37 + (${k} - r) * 600)
    FROM generate_series(1, ${n}) AS i CROSS JOIN generate_series(1, ${k}) AS r
  `.execute(db);
  // What autovacuum does to a live table after a bulk load: statistics, and GIN pending lists merged.
  await sql`VACUUM ANALYZE designs, revisions`.execute(db);
  return { designs: n, revisions: n * k };
}
