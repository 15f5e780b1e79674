// Local services for `npm start` and `npm test`: a private PostgreSQL cluster, the object-store
// fake and the SMTP fake. Plain Node with no dependencies, so it runs before `npm install`.
import { spawn, spawnSync, execFileSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function log(msg) {
  process.stdout.write(`[jigwright] ${msg}\n`);
}

function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', ...opts });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed (exit ${r.status})`);
}

function aptInstall(packages) {
  if (!isRoot) throw new Error(`Missing Debian packages: ${packages.join(' ')}. Install them with apt-get (needs root).`);
  log(`installing Debian packages: ${packages.join(' ')}`);
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

/** Installs npm dependencies when node_modules is missing or older than the lock file. */
export function ensureNodeModules() {
  const marker = path.join(repoRoot, 'node_modules', '.package-lock.json');
  const lock = path.join(repoRoot, 'package-lock.json');
  const stale = !fs.existsSync(marker) || (fs.existsSync(lock) && fs.statSync(lock).mtimeMs > fs.statSync(marker).mtimeMs + 1000);
  if (!stale) return;
  log('installing npm dependencies (npm ci)…');
  run('npm', [fs.existsSync(lock) ? 'ci' : 'install', '--no-audit', '--no-fund'], { cwd: repoRoot });
}

export function postgresBinDir() {
  const base = '/usr/lib/postgresql';
  if (!fs.existsSync(base)) return null;
  const versions = fs.readdirSync(base).filter((v) => fs.existsSync(path.join(base, v, 'bin', 'initdb'))).sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

export function ensurePostgresInstalled() {
  if (postgresBinDir()) return postgresBinDir();
  aptInstall(['postgresql']);
  const dir = postgresBinDir();
  if (!dir) throw new Error('PostgreSQL installed but initdb was not found under /usr/lib/postgresql');
  return dir;
}

export function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  aptInstall(['chromium']);
  return '/usr/bin/chromium';
}

/** Debian's ezdxf, used by tests as an independent DXF auditor. */
export function ensureEzdxf() {
  const ok = spawnSync('/usr/bin/python3', ['-c', 'import ezdxf'], { stdio: 'ignore' }).status === 0;
  if (!ok) aptInstall(['python3-ezdxf']);
}

function asPostgres(bin, args, opts = {}) {
  // initdb and postgres refuse to run as root; run them as the postgres system user from `/`.
  if (isRoot) return spawn('runuser', ['-u', 'postgres', '--', bin, ...args], { cwd: '/', ...opts });
  return spawn(bin, args, opts);
}

function asPostgresSync(bin, args) {
  const r = isRoot
    ? spawnSync('runuser', ['-u', 'postgres', '--', bin, ...args], { cwd: '/', encoding: 'utf8' })
    : spawnSync(bin, args, { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${path.basename(bin)} failed: ${r.stderr || r.stdout}`);
  return r.stdout;
}

function makeEnterable(dir) {
  // Every parent folder must be enterable by the postgres user.
  let d = path.resolve(dir);
  while (d !== path.dirname(d)) {
    try {
      const mode = fs.statSync(d).mode;
      if ((mode & 0o001) === 0) fs.chmodSync(d, mode | 0o001);
    } catch {
      /* parent we cannot change: initdb will say so */
    }
    d = path.dirname(d);
  }
}

export async function freePort() {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}

export async function waitForPort(port, timeoutMs = 20000) {
  const start = Date.now();
  while (Date.now() - start < timeoutMs) {
    const ok = await new Promise((resolve) => {
      const s = net.connect(port, '127.0.0.1');
      s.once('connect', () => { s.destroy(); resolve(true); });
      s.once('error', () => resolve(false));
    });
    if (ok) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`nothing listened on 127.0.0.1:${port} within ${timeoutMs} ms`);
}

/**
 * Creates (when missing) and starts a private cluster in `dataDir`, on 127.0.0.1:`port`, with its
 * socket inside the data folder. Returns { url, stop }.
 */
export async function startPostgres({ dataDir, port, fast = false }) {
  const bin = ensurePostgresInstalled();
  const pgdata = path.join(dataDir, 'pgdata');
  fs.mkdirSync(dataDir, { recursive: true });
  makeEnterable(dataDir);
  if (isRoot) execFileSync('chown', ['postgres:postgres', dataDir]);
  if (!fs.existsSync(path.join(pgdata, 'PG_VERSION'))) {
    log(`creating PostgreSQL cluster in ${path.relative(repoRoot, pgdata) || pgdata}`);
    asPostgresSync(path.join(bin, 'initdb'), ['-D', pgdata, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--no-locale']);
  }
  const stalePid = path.join(pgdata, 'postmaster.pid');
  if (fs.existsSync(stalePid)) {
    const pid = postmasterPid(pgdata);
    let alive = false;
    if (pid) {
      try { process.kill(pid, 0); alive = true; } catch { /* not running */ }
    }
    if (alive) throw new Error(`PostgreSQL already runs on this data folder (pid ${pid}); stop the other npm start first`);
    fs.rmSync(stalePid);
  }
  const args = ['-D', pgdata, '-h', '127.0.0.1', '-p', String(port), '-k', pgdata, '-c', 'max_connections=200'];
  if (fast) args.push('-c', 'fsync=off', '-c', 'synchronous_commit=off', '-c', 'full_page_writes=off');
  const logFile = fs.openSync(path.join(dataDir, 'postgres.log'), 'a');
  const child = asPostgres(path.join(bin, 'postgres'), args, { stdio: ['ignore', logFile, logFile] });
  let exited = false;
  child.on('exit', () => { exited = true; });
  await waitForPort(port, 30000).catch((e) => {
    throw new Error(`${e.message}; see ${path.join(dataDir, 'postgres.log')}`);
  });
  // The port answers before the server accepts logins; wait for a real query.
  await waitForPostgresReady(bin, port);
  return {
    url: `postgres://postgres@127.0.0.1:${port}/postgres`,
    port,
    child,
    stop: async () => {
      if (exited) return;
      // As root the child is runuser, which does not pass signals on: send the fast-shutdown
      // signal to the postmaster itself (its pid is the first line of postmaster.pid), then wait
      // for the child, which exits once PostgreSQL has (so the folder can be reused or removed).
      const pid = postmasterPid(pgdata);
      if (pid) {
        try { process.kill(pid, 'SIGINT'); } catch { /* already gone */ }
      }
      await stopChild(child, 'SIGINT', () => exited);
      // stopChild gives up after 10 s and kills only the wrapper: make sure the postmaster itself
      // has gone, so that nobody is told "stopped" while it still answers. Immediate shutdown
      // (SIGQUIT) if fast shutdown has not finished within 30 s.
      if (pid && !(await pidGone(pid, 30000))) {
        try { process.kill(pid, 'SIGQUIT'); } catch { /* gone meanwhile */ }
        if (!(await pidGone(pid, 10000))) throw new Error(`PostgreSQL (pid ${pid}) did not stop; see ${path.join(dataDir, 'postgres.log')}`);
      }
    },
  };
}

/** Waits until process `pid` no longer exists; false if it still does after `ms`. */
async function pidGone(pid, ms) {
  const until = Date.now() + ms;
  for (;;) {
    try {
      process.kill(pid, 0);
    } catch {
      return true;
    }
    // Exited but not yet reaped (its parent was killed): as gone as it gets.
    try {
      if (/^\d+ \(.*\) Z/.test(fs.readFileSync(`/proc/${pid}/stat`, 'utf8'))) return true;
    } catch {
      return true;
    }
    if (Date.now() > until) return false;
    await new Promise((r) => setTimeout(r, 50));
  }
}

function postmasterPid(pgdata) {
  try {
    const pid = Number(fs.readFileSync(path.join(pgdata, 'postmaster.pid'), 'utf8').split('\n')[0]);
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

async function waitForPostgresReady(bin, port) {
  for (let i = 0; i < 100; i++) {
    const r = spawnSync(path.join(bin, 'pg_isready'), ['-h', '127.0.0.1', '-p', String(port)], { stdio: 'ignore' });
    if (r.status === 0) return;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('PostgreSQL did not become ready');
}

async function stopChild(child, signal = 'SIGTERM', isExited = () => child.exitCode !== null) {
  if (isExited()) return;
  await new Promise((resolve) => {
    const timer = setTimeout(() => { try { child.kill('SIGKILL'); } catch { /* gone */ } resolve(); }, 10000);
    child.once('exit', () => { clearTimeout(timer); resolve(); });
    try { child.kill(signal); } catch { clearTimeout(timer); resolve(); }
  });
}

/** Starts one of the fakes in scripts/fakes as a child process and waits for its port. */
export async function startFake(name, { port, dir, extraEnv = {} }) {
  fs.mkdirSync(dir, { recursive: true });
  const child = spawn(process.execPath, [path.join(repoRoot, 'scripts', 'fakes', `${name}.mjs`)], {
    env: { ...process.env, FAKE_PORT: String(port), FAKE_DIR: dir, ...extraEnv },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  await waitForPort(port);
  return { port, child, stop: () => stopChild(child) };
}

export { stopChild };
