// Walks the real Express router stack of createApp() and fails for any /api route that does not
// come from ApiRouter.route() with a declared policy, or whose policy guard does not run first.
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { ROLE_RANK } from '../../server/http/policy';
import { createTestContext, type TestContext } from '../support/context';

interface FoundRoute {
  key: string;
  firstHandler: string;
}

// Express 5 (router 2.x) layers: `route` for a route, `handle.stack` for a mounted router,
// `rawPath` for the path it was mounted on.
type Layer = { route?: { path: string; methods: Record<string, boolean>; stack: { handle: { name: string } }[] }; handle: { stack?: Layer[] }; rawPath?: string };

/** Every route reachable in an app, with its full path and the name of the first handler that runs. */
function walk(stack: Layer[], prefix = ''): FoundRoute[] {
  const out: FoundRoute[] = [];
  for (const layer of stack) {
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods)) {
        out.push({ key: `${method.toUpperCase()} ${prefix}${layer.route.path}`, firstHandler: layer.route.stack[0]?.handle.name ?? '' });
      }
    } else if (Array.isArray(layer.handle.stack)) {
      out.push(...walk(layer.handle.stack, prefix + (layer.rawPath && layer.rawPath !== '/' ? layer.rawPath : '')));
    }
  }
  return out;
}

function appRoutes(app: express.Express): FoundRoute[] {
  return walk((app as unknown as { router: { stack: Layer[] } }).router.stack);
}

/** Problems with an app's /api routes; empty when every one is declared and guarded. */
function coverageProblems(app: express.Express, defs: { method: string; path: string; policy: unknown }[]): string[] {
  const declared = new Map(defs.map((d) => [`${d.method.toUpperCase()} /api${d.path}`, d.policy]));
  const problems: string[] = [];
  for (const r of appRoutes(app).filter((r) => /^[A-Z]+ \/api(\/|$)/.test(r.key))) {
    if (!declared.has(r.key)) problems.push(`${r.key} is not declared through ApiRouter.route()`);
    else if (r.firstHandler !== 'enforcePolicy') problems.push(`${r.key} runs ${r.firstHandler || 'an anonymous handler'} before its policy`);
  }
  return problems;
}

function policyProblem(policy: any): string | null {
  if (!policy || typeof policy !== 'object') return 'no policy';
  if (policy.kind === 'public' || policy.kind === 'signed-in') return null;
  if (policy.kind !== 'shop') return `unknown policy kind ${String(policy.kind)}`;
  if (!(policy.role in ROLE_RANK)) return `unknown role ${String(policy.role)}`;
  if (typeof policy.shop !== 'function') return 'shop policy without a shop locator';
  return null;
}

describe('route coverage', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => ctx?.close());

  it('finds every declared route in the Express stack', () => {
    const found = new Set(appRoutes(ctx.app).map((r) => r.key));
    expect(ctx.api.defs.length).toBeGreaterThan(10);
    for (const d of ctx.api.defs) expect(found, `${d.method} ${d.path}`).toContain(`${d.method.toUpperCase()} /api${d.path}`);
  });

  it('every /api route is declared with a valid policy that is enforced before its handlers', () => {
    expect(coverageProblems(ctx.app, ctx.api.defs)).toEqual([]);
    const bad = ctx.api.defs.map((d) => [`${d.method} ${d.path}`, policyProblem(d.policy)]).filter(([, p]) => p);
    expect(bad).toEqual([]);
  });

  it('would catch a route added around ApiRouter (the check can fail)', () => {
    const { app, api } = createApp(ctx.deps);
    api.router.get('/sneaky', (_req, res) => res.json({ ok: true })); // on the API router, no policy
    app.post('/api/direct', (_req, res) => res.end()); // on the app itself
    expect(coverageProblems(app, api.defs).sort()).toEqual(['GET /api/sneaky is not declared through ApiRouter.route()', 'POST /api/direct is not declared through ApiRouter.route()']);
  });
});
