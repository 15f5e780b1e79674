// `npm run bench` step one: what the benchmarks need before tsx can run them — the npm packages,
// Debian's PostgreSQL (for the bench's private cluster) and Debian's Chromium (web rows).
// Plain Node with no dependencies, like the other helpers in scripts/lib.
import { ensureChromium, ensureNodeModules, ensurePostgresInstalled } from './lib/services.mjs';

ensureNodeModules();
ensurePostgresInstalled();
ensureChromium();
