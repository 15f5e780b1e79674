// Calls every API route as anonymous, outsider (owner of another shop), viewer, editor and owner and
// checks each status against tests/api/authz-matrix.table.ts. A route without a row fails here.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../support/context';
import { buildFixture, PRINCIPALS, type Principal } from './authz-matrix.fixture';
import { FIXTURE_HOOKS, MATRIX } from './authz-matrix.table';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const keyOf = (d: { method: string; path: string }) => `${d.method.toUpperCase()} /api${d.path}`;

describe('authorization matrix', () => {
  it('has exactly one row for every route in api.defs', () => {
    const declared = ctx.api.defs.map(keyOf);
    const missing = declared.filter((k) => !(k in MATRIX));
    const stale = Object.keys(MATRIX).filter((k) => !declared.includes(k));
    expect(missing, 'routes with no row in tests/api/authz-matrix.table.ts').toEqual([]);
    expect(stale, 'rows for routes that do not exist').toEqual([]);
    expect(new Set(declared).size, 'a route is declared twice').toBe(declared.length);
  });

  for (const [key, row] of Object.entries(MATRIX)) {
    it(key, async () => {
      const def = ctx.api.defs.find((d) => keyOf(d) === key);
      expect(def, `${key} is not a declared route`).toBeDefined();
      const f = await buildFixture(ctx, FIXTURE_HOOKS);
      const got = {} as Record<Principal, number>;
      const why: string[] = [];
      // Least access first: a refused call changes nothing, so later principals see the same world.
      for (const who of PRINCIPALS) {
        const spec = await row.request(f, who);
        let req = ctx.http[def!.method](spec.path);
        const token = await f.tokenFor(who);
        if (token) req = req.set('Authorization', `Bearer ${token}`);
        if (spec.prepare) req = spec.prepare(req);
        else if (spec.body !== undefined) req = req.send(spec.body as object);
        const res = await req;
        got[who] = res.status;
        if (res.status !== row.expect[who]) why.push(`${who}: ${res.status} ${JSON.stringify(res.body?.error ?? '')}`);
      }
      expect(got, why.join('\n')).toEqual(row.expect);
    });
  }
});
