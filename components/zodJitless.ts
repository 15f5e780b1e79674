// Runs before any other app module (index.ts imports it first). The web app is served under a
// Content-Security-Policy without 'unsafe-eval' (server/app.ts); zod 4 compiles object parsers with
// `new Function` and probes for it when the first object schema is built, which the browser blocks
// and reports as a CSP violation. zod reads this global when it loads (zod/v4/core/core.js).
const g = globalThis as { __zod_globalConfig?: { jitless?: boolean } };
g.__zod_globalConfig = { ...g.__zod_globalConfig, jitless: true };
export {};
