// The bad-input suite: generated hostile requests against every route in api.defs that takes input
// (JSON bodies, multipart uploads, query strings, path parameters, the Authorization header). Each
// must get a 4xx with error.code and a clear error.message and no stack trace (OWASP Error
// Handling Cheat Sheet: no internals in answers), and must leave every table and the bucket exactly
// as they were. At the end the server still answers /api/health, the sweep (dry run) finds no
// orphan object, and every revision is whole. Prints: cases tried, failures, orphans found.
import fc from 'fast-check';
import { SignJWT } from 'jose';
import type { Test } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodType } from 'zod';
import { seedDemo } from '../../db/seed';
import { CALCULATORS, runCalculator } from '../../shared/calculators';
import { GENERATORS, runGenerator } from '../../shared/generators';
import { defaultParams } from '../../shared/params';
import { ChangePassword, ChangeRole, CreateInvite, CreateShop, RenameShop, RequestReset, ResetPassword, SignIn, SignUp } from '../../shared/schemas/auth';
import { ChargerInput, DeviceInput } from '../../shared/schemas/catalog';
import { CutLogInput } from '../../shared/schemas/cuts';
import { ChangeStatus, CreateDesign, CreateGeneratedRevision, ForkDesign, Regenerate, UpdateDesign } from '../../shared/schemas/library';
import { createTestContext, type TestContext } from '../support/context';
import { dxfFile, rectLines } from '../support/dxf';
import { dxfCases, type FileCase, goodDxf, svgCases } from '../support/hostileFiles';
import { diffSnapshots, errorAnswerProblems, orphans, revisionProblems, snapshot } from '../support/ledger';

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

let ctx: TestContext;
const env = {} as {
  shopId: string;
  secondShopId: string;
  owner: string;
  designId: string;
  revisionId: string;
  genRevisionId: string;
  genParams: Record<string, number | string | boolean>;
  cutId: string;
  deviceId: string;
  chargerId: string;
  inviteId: string;
  memberId: string;
  revokedToken: string;
};
const auth = () => ({ Authorization: `Bearer ${env.owner}` });

// ---- the tally every case reports to ----------------------------------------------------------
const tally = { tried: 0, failures: [] as string[], perRoute: new Map<string, number>() };

interface Want {
  status?: number | number[];
  code?: string | RegExp;
}

/** Sends one hostile request and checks the answer and that nothing changed. */
async function attempt(route: string, label: string, send: () => Test, want: Want = {}): Promise<string[]> {
  const before = await snapshot(ctx.db, ctx.deps.objects);
  let problems: string[];
  try {
    const res = await send();
    problems = errorAnswerProblems(res, want.status);
    const code = res.body?.error?.code;
    if (want.code && !(typeof want.code === 'string' ? code === want.code : want.code.test(String(code)))) problems.push(`code ${code}, wanted ${want.code}`);
    if (problems.length) problems.push(`answer: ${res.status} ${JSON.stringify(res.body?.error ?? res.text?.slice(0, 120))}`);
  } catch (e) {
    problems = [`request failed: ${(e as Error).message}`];
  }
  problems.push(...diffSnapshots(before, await snapshot(ctx.db, ctx.deps.objects)));
  tally.tried++;
  tally.perRoute.set(route, (tally.perRoute.get(route) ?? 0) + 1);
  if (problems.length) tally.failures.push(`${route} — ${label}: ${problems.join('; ')}`);
  return problems.map((p) => `${label}: ${p}`);
}

/** Runs a route's cases in order; the test fails listing every case that went wrong. */
async function runAll(route: string, cases: { label: string; send: () => Test; want?: Want }[]) {
  const problems: string[] = [];
  for (const c of cases) problems.push(...(await attempt(route, c.label, c.send, c.want)));
  expect(cases.length, `${route} has no cases`).toBeGreaterThan(0);
  expect(problems, `${route}: ${problems.length} case(s) went wrong`).toEqual([]);
}

// ---- JSON bodies: structural cases plus one mutation per leaf and kind of wrongness -------------
const DELETE = Symbol('delete');
type Leaf = { path: (string | number)[]; value: Json };

function leaves(v: Json, path: (string | number)[] = []): Leaf[] {
  const out: Leaf[] = path.length ? [{ path, value: v }] : [];
  if (Array.isArray(v)) {
    if (v.length) out.push(...leaves(v[0], [...path, 0]));
  } else if (v && typeof v === 'object') {
    for (const [k, x] of Object.entries(v)) out.push(...leaves(x, [...path, k]));
  }
  return out;
}

function withValue(base: Json, path: (string | number)[], value: Json | typeof DELETE): Json {
  const copy = structuredClone(base) as any;
  let at = copy;
  for (const k of path.slice(0, -1)) at = at[k];
  const last = path[path.length - 1];
  if (value === DELETE) {
    if (Array.isArray(at)) at.splice(Number(last), 1);
    else delete at[last];
  } else at[last] = value;
  return copy;
}

const HUGE = 'x'.repeat(100_000);
function wrongValues(v: Json): [string, Json | typeof DELETE][] {
  const common: [string, Json | typeof DELETE][] = [['missing', DELETE], ['null', null]];
  if (typeof v === 'string') return [...common, ['a number instead of text', 12345], ['empty', ''], ['100 000 characters', HUGE], ['a NUL character', 'a\u0000b'], ['a list', ['x']]];
  if (typeof v === 'number') return [...common, ['text instead of a number', String(v)], ['zero', 0], ['negative', -1], ['1e308', 1e308], ['-1e308', -1e308], ['"NaN"', 'NaN'], ['true', true]];
  if (typeof v === 'boolean') return [...common, ['"yes"', 'yes'], ['1', 1]];
  if (Array.isArray(v)) return [...common, ['text instead of a list', 'x'], ['an object instead of a list', {}], ['10 001 items', Array.from({ length: 10_001 }, () => 'x')]];
  if (v && typeof v === 'object') return [...common, ['text instead of an object', 'x'], ['a list instead of an object', []]];
  return common;
}

interface JsonRoute {
  key: string;
  method: 'post' | 'patch';
  path: () => string;
  base: () => Json;
  /** Would the server accept this body? Only bodies it must refuse are sent. */
  accepts: (body: unknown) => boolean;
  signedIn?: boolean;
  /** Most leaf mutations sent (chosen evenly from all of them). */
  cap?: number;
}

const parses = (schema: ZodType) => (b: unknown) => schema.safeParse(b).success;
const isObj = (b: unknown): b is Record<string, unknown> => !!b && typeof b === 'object' && !Array.isArray(b);

function jsonCases(r: JsonRoute): { label: string; send: () => Test; want?: Want }[] {
  const send = (body: Json | string, type = 'application/json') => () => {
    let req = ctx.http[r.method](r.path());
    if (r.signedIn !== false) req = req.set(auth());
    return req.set('Content-Type', type).send(typeof body === 'string' ? body : JSON.stringify(body));
  };
  const base = r.base();
  const cases: { label: string; send: () => Test; want?: Want }[] = [
    { label: 'body is not JSON (cut off)', send: send('{"title": "Fence st'), want: { status: 400, code: 'invalid_json' } },
    { label: 'body is a JSON list', send: send([base]) },
    { label: 'body is a bare number', send: send('42'), want: { status: 400 } },
    { label: 'body sent as text/plain', send: send(JSON.stringify(base), 'text/plain') },
    { label: 'an unknown field beside valid ones', send: send({ ...(base as object), zzUnexpected: 'x' }) },
    { label: '"__proto__" key (prototype pollution)', send: send(`{"__proto__": {"isAdmin": true}, ${JSON.stringify(base).slice(1)}`) },
    { label: '"constructor.prototype" key', send: send({ ...(base as object), constructor: { prototype: { isAdmin: true } } }) },
    { label: 'nested 5 000 deep', send: send(`{"zz": ${'['.repeat(5000)}${']'.repeat(5000)}}`) },
    { label: 'body over the 256 kB JSON limit', send: send({ ...(base as object), padding: 'y'.repeat(300 * 1024) }), want: { status: 413, code: 'too_large' } },
  ];
  const mutations: { label: string; body: Json }[] = [];
  for (const leaf of leaves(base)) {
    for (const [what, value] of wrongValues(leaf.value)) {
      const body = withValue(base, leaf.path, value);
      if (!r.accepts(body)) mutations.push({ label: `${leaf.path.join('.')}: ${what}`, body });
    }
  }
  // Random JSON values in place of the whole body and of each top-level field (fast-check, fixed seed).
  const randoms = fc.sample(fc.jsonValue({ maxDepth: 3 }), { seed: 7919, numRuns: 6 }) as Json[];
  for (const [i, v] of randoms.entries()) if (!r.accepts(v)) mutations.push({ label: `random JSON body #${i + 1}`, body: v });
  const cap = r.cap ?? 24;
  const step = Math.max(1, mutations.length / cap);
  for (let i = 0; i < mutations.length && cases.length < 9 + cap; i += step) {
    const m = mutations[Math.floor(i)];
    cases.push({ label: m.label, send: send(m.body) });
  }
  return cases;
}

const gen = GENERATORS[0];
const calc = CALCULATORS[0];

function jsonRoutes(): JsonRoute[] {
  return [
    {
      key: 'POST /api/generators/:id/preview',
      method: 'post',
      path: () => `/api/generators/${gen.id}/preview`,
      base: () => ({ params: defaultParams(gen.params) }),
      accepts: (b) => isObj(b) && Object.keys(b).every((k) => k === 'params') && runGenerator(gen.id, b.params).ok,
      signedIn: false,
      cap: 30,
    },
    {
      key: 'POST /api/calculators/:name',
      method: 'post',
      path: () => `/api/calculators/${calc.id}`,
      base: () => ({ params: defaultParams(calc.params) }),
      accepts: (b) => isObj(b) && Object.keys(b).every((k) => k === 'params') && runCalculator(calc.id, b.params).ok,
      signedIn: false,
    },
    { key: 'POST /api/auth/sign-up', method: 'post', path: () => '/api/auth/sign-up', base: () => ({ email: 'newcomer@birchfold.example', password: 'plane-iron-sharp-42', name: 'Wren Alder' }), accepts: parses(SignUp), signedIn: false },
    { key: 'POST /api/auth/sign-in', method: 'post', path: () => '/api/auth/sign-in', base: () => ({ email: 'owner@larchmere.example', password: 'larchmere-owner' }), accepts: parses(SignIn), signedIn: false },
    { key: 'POST /api/auth/password', method: 'post', path: () => '/api/auth/password', base: () => ({ currentPassword: 'larchmere-owner', newPassword: 'a-fresh-password-456' }), accepts: parses(ChangePassword) },
    { key: 'POST /api/auth/reset-request', method: 'post', path: () => '/api/auth/reset-request', base: () => ({ email: 'owner@larchmere.example' }), accepts: parses(RequestReset), signedIn: false },
    { key: 'POST /api/auth/reset', method: 'post', path: () => '/api/auth/reset', base: () => ({ token: 'A'.repeat(43), password: 'reset-password-789' }), accepts: () => false, signedIn: false },
    { key: 'POST /api/shops', method: 'post', path: () => '/api/shops', base: () => ({ name: 'Alderbank Guild' }), accepts: parses(CreateShop) },
    { key: 'PATCH /api/shops/:shopId', method: 'patch', path: () => `/api/shops/${env.shopId}`, base: () => ({ name: 'Fernhollow Cabinet Works' }), accepts: parses(RenameShop) },
    { key: 'PATCH /api/shops/:shopId/members/:userId', method: 'patch', path: () => `/api/shops/${env.shopId}/members/${env.memberId}`, base: () => ({ role: 'viewer' }), accepts: parses(ChangeRole) },
    { key: 'POST /api/shops/:shopId/invites', method: 'post', path: () => `/api/shops/${env.shopId}/invites`, base: () => ({ email: 'invitee@birchfold.example', role: 'viewer' }), accepts: parses(CreateInvite) },
    {
      key: 'POST /api/shops/:shopId/designs',
      method: 'post',
      path: () => `/api/shops/${env.shopId}/designs`,
      base: () => ({ kind: 'jig', title: 'Fence stop', description: 'Stop block for the crosscut sled', tags: ['sled'], material: 'birch ply' }),
      accepts: parses(CreateDesign),
    },
    { key: 'PATCH /api/designs/:designId', method: 'patch', path: () => `/api/designs/${env.designId}`, base: () => ({ title: 'Grommet template', tags: ['cord'], material: 'MDF', description: 'x' }), accepts: parses(UpdateDesign) },
    {
      key: 'POST /api/designs/:designId/revisions',
      method: 'post',
      path: () => `/api/designs/${env.designId}/revisions`,
      base: () => ({
        generatorId: gen.id,
        params: defaultParams(gen.params),
        message: 'Generated for the test bench',
        status: 'draft',
        fitNotes: { device: { name: 'Test phone', width: 70, length: 150, thickness: 8, cased: false }, clearancePerSide: 0.4, bitDiameter: 6.35, stock: { material: 'walnut', thickness: 12 } },
      }),
      accepts: (b) => CreateGeneratedRevision.safeParse(b).success && runGenerator((b as { generatorId: string }).generatorId, (b as { params: unknown }).params).ok,
      cap: 40,
    },
    {
      key: 'POST /api/designs/:designId/forks',
      method: 'post',
      path: () => `/api/designs/${env.designId}/forks`,
      base: () => ({ revisionId: env.revisionId, targetShopId: env.shopId, title: 'Forked grommet' }),
      accepts: (b) => ForkDesign.safeParse(b).success && (b as { revisionId: string }).revisionId === env.revisionId && [env.shopId, env.secondShopId].includes((b as { targetShopId: string }).targetShopId),
    },
    { key: 'PATCH /api/revisions/:revisionId/status', method: 'patch', path: () => `/api/revisions/${env.revisionId}/status`, base: () => ({ status: 'trial' }), accepts: parses(ChangeStatus) },
    {
      key: 'POST /api/revisions/:revisionId/regenerate',
      method: 'post',
      path: () => `/api/revisions/${env.genRevisionId}/regenerate`,
      base: () => ({ device: Object.fromEntries((gen.deviceParams ?? []).map((k) => [k, Number(env.genParams[k])])), message: 'For another phone' }),
      accepts: (b) => {
        if (!Regenerate.safeParse(b).success) return false;
        const body = b as { deviceId?: string; device?: Record<string, number> };
        if (body.deviceId) return body.deviceId === env.deviceId;
        const keys = Object.keys(body.device ?? {});
        return keys.every((k) => (gen.deviceParams ?? []).includes(k)) && runGenerator(gen.id, { ...env.genParams, ...body.device }).ok;
      },
    },
    { key: 'POST /api/shops/:shopId/devices', method: 'post', path: () => `/api/shops/${env.shopId}/devices`, base: () => ({ name: 'Bench tablet', widthMm: 120, lengthMm: 190, thicknessMm: 7, caseAllowanceMm: 1 }), accepts: parses(DeviceInput) },
    {
      key: 'POST /api/shops/:shopId/chargers',
      method: 'post',
      path: () => `/api/shops/${env.shopId}/chargers`,
      base: () => ({ name: 'Oval pad', shape: 'rect', widthMm: 60, lengthMm: 80, thicknessMm: 6, rangeMinMm: 0, rangeMaxMm: 4 }),
      accepts: parses(ChargerInput),
    },
    {
      key: 'POST /api/revisions/:revisionId/cuts',
      method: 'post',
      path: () => `/api/revisions/${env.revisionId}/cuts`,
      base: () => ({ cutOn: '2026-11-20', material: 'birch ply', bitMm: 6.35, machineNote: 'downcut', clearanceMm: 0.4, measuredWidthMm: 120.2, measuredLengthMm: 80.1, result: 'good' }),
      accepts: parses(CutLogInput),
    },
  ];
}

// ---- multipart uploads --------------------------------------------------------------------------
function uploadTo(path: string, file: FileCase | { body: Buffer; fields?: Record<string, string> }, name = 'part.dxf', message: string | null = 'Hostile upload') {
  return () => {
    const req = ctx.http.post(path).set(auth());
    if (message !== null) req.field('message', message);
    for (const [k, v] of Object.entries(file.fields ?? {})) req.field(k, v);
    return req.attach('file', file.body, name);
  };
}

function multipartCases(path: string, uploadMax: number) {
  const good = goodDxf();
  const raw = (contentType: string, body: string | Buffer) => () => ctx.http.post(path).set(auth()).set('Content-Type', contentType).send(body);
  return [
    { label: 'no file part', send: () => ctx.http.post(path).set(auth()).field('message', 'No file'), want: { status: 400 } },
    { label: 'file under another field name', send: () => ctx.http.post(path).set(auth()).field('message', 'm').attach('drawing', good, 'a.dxf'), want: { status: 400, code: 'bad_upload' } },
    { label: 'two files', send: () => ctx.http.post(path).set(auth()).field('message', 'm').attach('file', good, 'a.dxf').attach('file', good, 'b.dxf'), want: { status: 400, code: 'bad_upload' } },
    { label: 'nine text fields (limit 8)', send: () => { const r = ctx.http.post(path).set(auth()); for (let i = 0; i < 9; i++) r.field(`f${i}`, 'x'); return r.attach('file', good, 'a.dxf'); }, want: { status: 400 } },
    { label: 'a 70 kB text field (limit 64 kB)', send: () => ctx.http.post(path).set(auth()).field('message', 'm'.repeat(70 * 1024)).attach('file', good, 'a.dxf'), want: { status: 400, code: 'bad_upload' } },
    { label: 'an unknown text field', send: () => ctx.http.post(path).set(auth()).field('message', 'm').field('zzUnexpected', '1').attach('file', good, 'a.dxf'), want: { status: 400 } },
    { label: 'file one byte over the upload limit', send: () => ctx.http.post(path).set(auth()).field('message', 'm').attach('file', Buffer.alloc(uploadMax + 1, 0x20), 'big.dxf'), want: { status: 413, code: 'file_too_large' } },
    { label: 'multipart without a boundary (RFC 7578 §4.1)', send: raw('multipart/form-data', 'garbage'), want: { status: 400, code: 'bad_upload' } },
    { label: 'multipart cut off before its closing boundary (RFC 7578 §4.1)', send: raw('multipart/form-data; boundary=XX', '--XX\r\nContent-Disposition: form-data; name="file"; filename="a.dxf"\r\n\r\n0\nSECTION\n'), want: { status: 400, code: 'bad_upload' } },
    { label: 'multipart part without Content-Disposition (RFC 7578 §4.2)', send: raw('multipart/form-data; boundary=XX', '--XX\r\nX-Nothing: 1\r\n\r\nabc\r\n--XX--\r\n'), want: { status: 400 } },
    { label: 'JSON body instead of multipart', send: () => ctx.http.post(path).set(auth()).send({ message: 'x', file: 'base64…' }), want: { status: 400 } },
  ];
}

function uploadFieldCases(path: string) {
  const good = { body: goodDxf() };
  return [
    { label: 'message missing', send: uploadTo(path, good, 'a.dxf', null), want: { status: 400, code: 'invalid_input' } },
    { label: 'message of spaces only', send: uploadTo(path, good, 'a.dxf', '   '), want: { status: 400 } },
    { label: 'message of 501 characters', send: uploadTo(path, good, 'a.dxf', 'm'.repeat(501)), want: { status: 400 } },
    { label: 'status "finished"', send: uploadTo(path, { ...good, fields: { status: 'finished' } }), want: { status: 400 } },
    { label: 'fitNotes that are not JSON', send: uploadTo(path, { ...good, fields: { fitNotes: '{device:' } }), want: { status: 400 } },
    { label: 'fitNotes with a zero device width', send: uploadTo(path, { ...good, fields: { fitNotes: JSON.stringify({ device: { width: 0, length: 150, thickness: 8, cased: false } }) } }), want: { status: 400 } },
    { label: 'fitNotes with a negative device thickness', send: uploadTo(path, { ...good, fields: { fitNotes: JSON.stringify({ device: { width: 70, length: 150, thickness: -8, cased: false } }) } }), want: { status: 400 } },
    { label: 'fitNotes with clearance 1e308', send: uploadTo(path, { ...good, fields: { fitNotes: JSON.stringify({ clearancePerSide: 1e308 }) } }), want: { status: 400 } },
    { label: 'fitNotes with an unknown key', send: uploadTo(path, { ...good, fields: { fitNotes: JSON.stringify({ colour: 'red' }) } }), want: { status: 400 } },
    { label: 'fitNotes with a NUL in the text', send: uploadTo(path, { ...good, fields: { fitNotes: JSON.stringify({ text: 'a\u0000b' }) } }), want: { status: 400 } },
  ];
}

// ---- query strings, path parameters, tokens -----------------------------------------------------
const NIL = '00000000-0000-4000-8000-000000000000';
const BAD_PARAMS: [string, string, number][] = [
  ['not a uuid', 'not-a-uuid', 404],
  ['a uuid of nothing', NIL, 404],
  ['a broken %-escape', '%E0%A4%A', 400],
  ['SQL in the id', encodeURIComponent("1' OR '1'='1"), 404],
  ['a 2 000-character id', 'a'.repeat(2000), 404],
];

function validParam(name: string): string {
  const map: Record<string, string> = {
    shopId: env.shopId, designId: env.designId, revisionId: env.revisionId, otherId: env.revisionId, userId: env.memberId, inviteId: env.inviteId,
    deviceId: env.deviceId, chargerId: env.chargerId, cutId: env.cutId, token: 'A'.repeat(43), id: gen.id, name: calc.id,
  };
  if (!(name in map)) throw new Error(`no valid value for :${name}`);
  return map[name];
}

const keyOf = (d: { method: string; path: string }) => `${d.method.toUpperCase()} /api${d.path}`;

/** For a route with path parameters: each one replaced by each bad value, the others valid. */
function pathCases(def: { method: string; path: string }, bodyOf?: () => Json) {
  const names = [...def.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
  const out: { label: string; send: () => Test; want?: Want }[] = [];
  for (const n of names) {
    for (const [what, bad, status] of BAD_PARAMS) {
      const path = '/api' + def.path.replace(/:(\w+)/g, (_m, p: string) => (p === n ? bad : validParam(p)));
      // The public invite routes answer an unreadable token as not found, like any other bad token.
      out.push({
        label: `:${n} is ${what}`,
        send: () => {
          const req = (ctx.http as any)[def.method](path).set(auth());
          return bodyOf ? req.send(bodyOf()) : req;
        },
        want: { status },
      });
    }
  }
  return out;
}

async function badTokens(): Promise<[string, string][]> {
  const secret = ctx.config.sessionSecret;
  const other = new TextEncoder().encode('another-secret-that-is-long-enough-9876543210');
  const claims = { sid: NIL };
  const sign = (key: Uint8Array, exp: number | string) => new SignJWT(claims).setProtectedHeader({ alg: 'HS256' }).setSubject(NIL).setIssuer('jigwright').setAudience('jigwright-api').setIssuedAt().setExpirationTime(exp).sign(key);
  const none = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${Buffer.from(JSON.stringify({ sid: NIL, sub: NIL, iss: 'jigwright', aud: 'jigwright-api' })).toString('base64url')}.`;
  return [
    ['garbage token', 'Bearer not-a-token'],
    ['token signed with another secret', `Bearer ${await sign(other, '1h')}`],
    ['expired token', `Bearer ${await sign(secret, Math.floor(Date.now() / 1000) - 60)}`],
    ['alg "none" token (RFC 8725 §3.1)', `Bearer ${none}`],
    ['token of a signed-out session', `Bearer ${env.revokedToken}`],
    ['Basic credentials instead of Bearer', `Basic ${Buffer.from('owner@larchmere.example:larchmere-owner').toString('base64')}`],
  ];
}

function queryCases(route: string): { label: string; query: string; status?: number }[] {
  switch (route) {
    case 'GET /api/shops/:shopId/designs':
      return [
        { label: 'limit 0', query: 'limit=0' },
        { label: 'limit 101 (max 100)', query: 'limit=101' },
        { label: 'limit "many"', query: 'limit=many' },
        { label: 'limit 1e308', query: 'limit=1e308' },
        { label: 'sort "price"', query: 'sort=price' },
        { label: 'dir "up"', query: 'dir=up' },
        { label: 'kind "chair"', query: 'kind=chair' },
        { label: 'status "finished"', query: 'status=finished' },
        { label: 'q of 201 characters', query: `q=${'a'.repeat(201)}` },
        { label: 'q given twice', query: 'q=a&q=b' },
        { label: 'q as a nested object', query: 'q[a]=b' },
        { label: 'an unknown parameter', query: 'zz=1' },
        { label: 'cursor that is not base64 JSON', query: 'cursor=!!!' },
        { label: 'cursor with a date that is not a date', query: `cursor=${Buffer.from(JSON.stringify(['yesterday', NIL])).toString('base64url')}` },
        { label: 'cursor with an id that is not a uuid', query: `cursor=${Buffer.from(JSON.stringify([new Date().toISOString(), 'nope'])).toString('base64url')}` },
        { label: 'cursor of 501 characters', query: `cursor=${'A'.repeat(501)}` },
        { label: 'a NUL in q', query: 'q=a%00b&material=x%00' },
      ];
    case 'GET /api/revisions/:revisionId/download':
      return [
        { label: 'format "exe"', query: 'format=exe' },
        { label: 'units "cm"', query: 'units=cm' },
        { label: 'link "yes"', query: 'link=yes' },
        { label: 'an unknown parameter', query: 'format=dxf&zz=1' },
      ];
    case 'GET /api/revisions/:revisionId/template.pdf':
      return [
        { label: 'paper "a3"', query: 'paper=a3' },
        { label: 'units "ft"', query: 'units=ft' },
        { label: 'an unknown parameter', query: 'scale=2' },
      ];
    case 'GET /api/shops/:shopId/fit-history':
      return [
        { label: 'no device or material', query: '' },
        { label: 'device of 201 characters', query: `device=${'d'.repeat(201)}&material=oak` },
        { label: 'material empty', query: 'device=Demo%20phone%20S&material=' },
        { label: 'a NUL in the device', query: 'device=a%00b&material=oak' },
      ];
    default:
      return [];
  }
}

// ---- the world the cases run in -----------------------------------------------------------------
beforeAll(async () => {
  ctx = await createTestContext();
  const seed = await seedDemo(ctx.db, { bcryptCost: 4 });
  env.shopId = seed.shopId;
  env.secondShopId = seed.secondShopId;
  env.memberId = seed.users['editor@larchmere.example'];
  const signIn = async (email: string, password: string) => (await ctx.http.post('/api/auth/sign-in').send({ email, password })).body.token as string;
  env.owner = await signIn('owner@larchmere.example', 'larchmere-owner');
  env.revokedToken = await signIn('viewer@larchmere.example', 'larchmere-viewer');
  expect((await ctx.http.post('/api/auth/sign-out').set({ Authorization: `Bearer ${env.revokedToken}` })).status).toBe(204);
  const d = await ctx.http.post(`/api/shops/${env.shopId}/designs`).set(auth()).send({ kind: 'template', title: 'Grommet template' });
  env.designId = d.body.id;
  const up = await ctx.http.post(`/api/designs/${env.designId}/revisions/upload`).set(auth()).field('message', 'r1').attach('file', Buffer.from(dxfFile(rectLines(120, 80))), 'r1.dxf');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  env.revisionId = up.body.id;
  const g = await ctx.http.post(`/api/designs/${env.designId}/revisions`).set(auth()).send({ generatorId: gen.id, params: {}, message: 'generated' });
  expect(g.status, JSON.stringify(g.body)).toBe(201);
  env.genRevisionId = g.body.id;
  env.genParams = (await ctx.http.get(`/api/revisions/${env.genRevisionId}`).set(auth())).body.params;
  const cut = await ctx.http.post(`/api/revisions/${env.revisionId}/cuts`).set(auth()).send({ cutOn: '2026-11-20', material: 'birch ply', bitMm: 6.35, result: 'good' });
  expect(cut.status, JSON.stringify(cut.body)).toBe(201);
  env.cutId = cut.body.id;
  env.deviceId = (await ctx.http.get(`/api/shops/${env.shopId}/devices`).set(auth())).body.items[0].id;
  env.chargerId = (await ctx.http.get(`/api/shops/${env.shopId}/chargers`).set(auth())).body.items[0].id;
  const inv = await ctx.http.post(`/api/shops/${env.shopId}/invites`).set(auth()).send({ email: 'apprentice@birchfold.example', role: 'viewer' });
  expect(inv.status, JSON.stringify(inv.body)).toBe(201);
  env.inviteId = inv.body.invite.id;
}, 60_000);
afterAll(async () => ctx?.close());

describe('hostile JSON bodies', () => {
  for (const r of jsonRoutes()) {
    it(r.key, async () => {
      await runAll(r.key, jsonCases(r));
    }, 60_000);
  }
});

describe('hostile drawing files', () => {
  const upload = 'POST /api/designs/:designId/revisions/upload';
  const inspect = 'POST /api/designs/:designId/uploads/inspect';
  for (const [kind, list] of [['DXF', dxfCases()], ['SVG', svgCases()]] as const) {
    for (const route of [upload, inspect]) {
      it(`${route}: ${list.length} broken or hostile ${kind} files`, async () => {
        const path = route === upload ? `/api/designs/${env.designId}/revisions/upload` : `/api/designs/${env.designId}/uploads/inspect`;
        // inspect takes no message field
        const msg = route === upload ? 'Hostile upload' : null;
        await runAll(
          route,
          list.map((c) => ({ label: `${c.label} [${c.ref}]`, send: uploadTo(path, c, kind === 'DXF' ? 'part.dxf' : 'part.svg', msg), want: { status: c.status ?? 400, code: c.code } })),
        );
      }, 120_000);
    }
  }
  it(`${upload}: broken multipart and bad form fields`, async () => {
    await runAll(upload, [...multipartCases(`/api/designs/${env.designId}/revisions/upload`, ctx.config.uploadMaxBytes), ...uploadFieldCases(`/api/designs/${env.designId}/revisions/upload`)]);
  }, 60_000);
  it(`${inspect}: broken multipart`, async () => {
    const path = `/api/designs/${env.designId}/uploads/inspect`;
    await runAll(inspect, multipartCases(path, ctx.config.uploadMaxBytes).filter((c) => !/unknown text field|no file part/.test(c.label)));
  }, 60_000);
  it('POST /api/revisions/:revisionId/cuts: multipart with a bad photo or fields', async () => {
    const path = `/api/revisions/${env.revisionId}/cuts`;
    const form = (fields: Record<string, string>, photo?: Buffer, name = 'photo.jpg') => () => {
      const req = ctx.http.post(path).set(auth());
      for (const [k, v] of Object.entries(fields)) req.field(k, v);
      return photo ? req.attach('photo', photo, name) : req;
    };
    const ok = { cutOn: '2026-11-20', material: 'oak', bitMm: '6.35', result: 'good' };
    const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(100)]);
    await runAll('POST /api/revisions/:revisionId/cuts', [
      { label: 'photo that is a DXF, not JPEG or PNG (OWASP File Upload Cheat Sheet: check the content)', send: form(ok, goodDxf(), 'photo.jpg'), want: { status: 400, code: 'bad_photo' } },
      { label: 'photo that is an SVG with a script', send: form(ok, Buffer.from('<svg onload="alert(1)"/>'), 'photo.png'), want: { status: 400, code: 'bad_photo' } },
      { label: 'photo over 8 MB', send: form(ok, Buffer.concat([jpeg, Buffer.alloc(8 * 1024 * 1024)])), want: { status: 413, code: 'file_too_large' } },
      { label: 'bitMm "wide"', send: form({ ...ok, bitMm: 'wide' }, jpeg), want: { status: 400 } },
      { label: 'bitMm 0', send: form({ ...ok, bitMm: '0' }, jpeg), want: { status: 400 } },
      { label: 'bitMm -3', send: form({ ...ok, bitMm: '-3' }, jpeg), want: { status: 400 } },
      { label: 'measuredWidthMm 1e308', send: form({ ...ok, measuredWidthMm: '1e308' }, jpeg), want: { status: 400 } },
      { label: 'cutOn "yesterday"', send: form({ ...ok, cutOn: 'yesterday' }, jpeg), want: { status: 400 } },
      { label: 'result "perfect"', send: form({ ...ok, result: 'perfect' }, jpeg), want: { status: 400 } },
      { label: 'an unknown field', send: form({ ...ok, zz: '1' }, jpeg), want: { status: 400 } },
      { label: 'a NUL in the material', send: form({ ...ok, material: 'o\u0000ak' }, jpeg), want: { status: 400 } },
      { label: 'two photos', send: () => ctx.http.post(path).set(auth()).field('cutOn', ok.cutOn).attach('photo', jpeg, 'a.jpg').attach('photo', jpeg, 'b.jpg'), want: { status: 400, code: 'bad_upload' } },
      { label: 'multipart cut off (RFC 7578 §4.1)', send: () => ctx.http.post(path).set(auth()).set('Content-Type', 'multipart/form-data; boundary=QQ').send('--QQ\r\nContent-Disposition: form-data; name="photo"; filename="a.jpg"\r\n\r\n\xff\xd8'), want: { status: 400, code: 'bad_upload' } },
    ]);
  }, 60_000);
});

describe('hostile query strings', () => {
  for (const route of ['GET /api/shops/:shopId/designs', 'GET /api/revisions/:revisionId/download', 'GET /api/revisions/:revisionId/template.pdf', 'GET /api/shops/:shopId/fit-history']) {
    it(route, async () => {
      const path = route.split(' ')[1].replace(/:(\w+)/g, (_m, p: string) => validParam(p));
      await runAll(route, queryCases(route).map((q) => ({ label: q.label, send: () => ctx.http.get(`${path}?${q.query}`).set(auth()), want: { status: q.status ?? 400 } })));
    });
  }
});

describe('hostile path parameters and tokens', () => {
  it('every route with a path parameter refuses malformed and unknown ids', async () => {
    const bodies = new Map(jsonRoutes().map((r) => [r.key, r.base] as const));
    for (const def of ctx.api.defs.filter((d) => d.path.includes(':'))) {
      await runAll(keyOf(def), pathCases(def, bodies.get(keyOf(def))));
    }
  }, 120_000);

  it('every route that needs a session refuses bad, forged, expired and signed-out tokens', async () => {
    const tokens = await badTokens();
    const defs = ctx.api.defs.filter((d) => d.policy.kind !== 'public');
    for (const [i, def] of defs.entries()) {
      const path = '/api' + def.path.replace(/:(\w+)/g, (_m, p: string) => validParam(p));
      // Two of the six kinds per route, in turn, so every kind meets every sort of route.
      const mine = [tokens[i % tokens.length], tokens[(i + 3) % tokens.length]];
      await runAll(keyOf(def), mine.map(([label, header]) => ({ label, send: () => (ctx.http as any)[def.method](path).set('Authorization', header), want: { status: 401, code: 'unauthorized' } })));
    }
  }, 120_000);
});

// Not refusals: a drawing in the wrong units is still a drawing. What the importer does is flag a
// part whose size says its units were probably misread (1 in = 25.4 mm exactly, 16 CFR 500.19), on
// inspect (before anything is saved) and on upload. The window, 10 mm to 3050 mm on the longest
// side, is server/revisions/geometry.ts PLAUSIBLE_SIZE_MM (common practice, from memory).
describe('mm/inch mix-ups are flagged, not refused', () => {
  const inspect = (body: Buffer, units?: string) => {
    const req = ctx.http.post(`/api/designs/${env.designId}/uploads/inspect`).set(auth());
    if (units) req.field('units', units);
    return req.attach('file', body, 'part.dxf');
  };

  it('an inch drawing read as millimetres (25.4× too small) is flagged with its size in inches', async () => {
    // 4.724 × 3.150: a 120 × 80 mm plate drawn in inches, in a file without $INSUNITS.
    const r = await inspect(Buffer.from(dxfFile(rectLines(4.724, 3.15), null)), 'mm');
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.sizeCheck).toMatchObject({ problem: 'tiny', otherUnits: { units: 'in' } });
    expect(r.body.sizeCheck.otherUnits.widthMm).toBeCloseTo(4.724 * 25.4, 1);
    expect(r.body.warnings.join(' ')).toMatch(/drawn in inches/);
    // Read as inches, the same file is a plausible part and is not flagged.
    const asInches = await inspect(Buffer.from(dxfFile(rectLines(4.724, 3.15), null)), 'in');
    expect(asInches.body.sizeCheck).toBeNull();
    expect(asInches.body.summary.extents.width).toBeCloseTo(120, 1);
  });

  it('a millimetre drawing whose header says inches (25.4× too large) is flagged with its size in millimetres', async () => {
    const r = await inspect(Buffer.from(dxfFile(rectLines(240, 160), 1)));
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.sizeCheck).toMatchObject({ problem: 'huge', otherUnits: { units: 'mm', widthMm: 240, heightMm: 160 } });
    expect(r.body.warnings.join(' ')).toMatch(/drawn in millimetres/);
  });

  it('a plausible part is not flagged, and an upload carries the flag too', async () => {
    expect((await inspect(Buffer.from(dxfFile(rectLines(240, 160), 4)))).body.sizeCheck).toBeNull();
    const up = await ctx.http.post(`/api/designs/${env.designId}/revisions/upload`).set(auth()).field('message', 'tiny part').field('units', 'mm').attach('file', Buffer.from(dxfFile(rectLines(4.724, 3.15), null)), 'tiny.dxf');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    expect(up.body.sizeCheck).toMatchObject({ problem: 'tiny' });
  });

  it('a Latin-1 DXF keeps its layer names (Autodesk DXF Reference: pre-2007 files use the ANSI code page)', async () => {
    const text = dxfFile(rectLines(100, 60, 'Kästchen'), 4);
    const r = await inspect(Buffer.from(text, 'latin1'));
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.warnings.join(' ')).toContain('"Kästchen"');
  });
});

describe('after every hostile case', () => {
  /** Public routes that take no input at all: nothing to send them that is wrong. */
  const NO_INPUT = ['GET /api/health', 'GET /api/generators', 'GET /api/calculators'];

  it('every route in api.defs that takes input was tried', () => {
    const missing = ctx.api.defs.map(keyOf).filter((k) => !NO_INPUT.includes(k) && !tally.perRoute.has(k));
    expect(missing, 'routes without hostile cases').toEqual([]);
  });

  it('the server is up, no orphan object is left, every revision is whole', async () => {
    const health = await ctx.http.get('/api/health');
    expect(health.status).toBe(200);
    const found = await orphans(ctx.deps);
    const broken = await revisionProblems(ctx.deps, { content: true });
    console.log(`[hostile-inputs] cases tried: ${tally.tried}, failures: ${tally.failures.length}, orphans found: ${found.length} (routes covered: ${tally.perRoute.size})`);
    if (tally.failures.length) console.log(tally.failures.slice(0, 40).join('\n'));
    expect(tally.tried).toBeGreaterThanOrEqual(200);
    expect(found, 'objects no row refers to').toEqual([]);
    expect(broken).toEqual([]);
    expect(tally.failures).toEqual([]);
  });
});
