// A Galera cluster on one machine: 3 MariaDB nodes on loopback, app instances each pointed at its own node first,
// and the local mail and push stand-ins. Used by `npm run cluster` (scripts/ha/cluster.ts) and by the fault suite
// (scripts/ha/fault-suite.ts). Every process is started here and stopped by its own PID.
import { execFile, spawn, type ChildProcess } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { chmodSync, chownSync, existsSync, mkdirSync, openSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'

const run = promisify(execFile)
export const ROOT = resolve(new URL('../..', import.meta.url).pathname)

function portList(name: string, fallback: number[]): number[] {
  const raw = process.env[name]
  if (!raw) return fallback
  const list = raw.split(',').map(s => Number(s.trim()))
  if (list.some(n => !Number.isInteger(n) || n < 1 || n > 65535)) throw new Error(`${name} must be a comma-separated list of ports, got ${raw}`)
  return list
}

export type ClusterConfig = {
  dataDir: string
  dbPorts: number[]
  galeraPorts: number[]
  istPorts: number[]
  sstPorts: number[]
  appPorts: number[]
  smtpPort: number
  pushPort: number
  dbName: string
}

/**
 * Ports come from the environment (3 of each for the nodes; 2 or 3 app ports), defaults in brackets:
 * VEERLINE_CLUSTER_DB_PORTS (3371,3372,3373), VEERLINE_CLUSTER_GALERA_PORTS (4571,4572,4573: group communication),
 * VEERLINE_CLUSTER_IST_PORTS (4581,4582,4583), VEERLINE_CLUSTER_SST_PORTS (4591,4592,4593: the rsync daemon of a
 * joiner), VEERLINE_CLUSTER_APP_PORTS (3181,3182,3183), VEERLINE_CLUSTER_SMTP_PORT (2579), VEERLINE_CLUSTER_PUSH_PORT
 * (8479), VEERLINE_CLUSTER_DATA_DIR (.data/cluster).
 */
export function clusterConfig(): ClusterConfig {
  const three = (name: string, fallback: number[]) => {
    const list = portList(name, fallback)
    if (list.length !== 3) throw new Error(`${name} needs 3 ports: Galera needs 3 nodes for a quorum`)
    return list
  }
  const appPorts = portList('VEERLINE_CLUSTER_APP_PORTS', [3181, 3182, 3183])
  if (appPorts.length < 2 || appPorts.length > 3) throw new Error('VEERLINE_CLUSTER_APP_PORTS needs 2 or 3 ports')
  return {
    dataDir: resolve(process.env.VEERLINE_CLUSTER_DATA_DIR || join(ROOT, '.data/cluster')),
    dbPorts: three('VEERLINE_CLUSTER_DB_PORTS', [3371, 3372, 3373]),
    galeraPorts: three('VEERLINE_CLUSTER_GALERA_PORTS', [4571, 4572, 4573]),
    istPorts: three('VEERLINE_CLUSTER_IST_PORTS', [4581, 4582, 4583]),
    sstPorts: three('VEERLINE_CLUSTER_SST_PORTS', [4591, 4592, 4593]),
    appPorts,
    smtpPort: Number(process.env.VEERLINE_CLUSTER_SMTP_PORT || 2579),
    pushPort: Number(process.env.VEERLINE_CLUSTER_PUSH_PORT || 8479),
    dbName: 'veerline',
  }
}

const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))

export function log(message: string) {
  console.log(`\x1b[36m[cluster]\x1b[0m ${new Date().toISOString().slice(11, 23)} ${message}`)
}

function keptSecret(file: string): string {
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 })
  return readFileSync(file, 'utf8').trim()
}

type Proc = { child: ChildProcess, name: string }

export class Cluster {
  readonly cfg: ClusterConfig
  readonly nodes: (Proc | null)[] = [null, null, null]
  readonly apps: (Proc | null)[]
  readonly standins: Record<'smtp' | 'push', Proc | null> = { smtp: null, push: null }
  readonly dbPassword: string
  readonly sessionPassword: string
  stopping = false

  constructor(cfg = clusterConfig()) {
    this.cfg = cfg
    this.apps = cfg.appPorts.map(() => null)
    mkdirSync(cfg.dataDir, { recursive: true })
    this.dbPassword = keptSecret(join(cfg.dataDir, 'db-password'))
    this.sessionPassword = keptSecret(join(cfg.dataDir, 'session-password'))
  }

  nodeDir(i: number) { return join(this.cfg.dataDir, `n${i + 1}`) }
  socket(i: number) { return join(this.nodeDir(i), 'run', 's.sock') }
  galeraPort(i: number) { return this.cfg.galeraPorts[i]! }
  gcommAddress() { return `gcomm://${[0, 1, 2].map(i => `127.0.0.1:${this.galeraPort(i)}`).join(',')}` }

  /** The URL an app instance is given: its own node first, then the others (see server/utils/db.ts). */
  databaseUrl(firstNode: number) {
    const order = [firstNode, ...[0, 1, 2].filter(i => i !== firstNode)]
    const hosts = order.map(i => `127.0.0.1:${this.cfg.dbPorts[i]}`).join(',')
    return `mysql://veerline:${this.dbPassword}@${hosts}/${this.cfg.dbName}`
  }

  appUrl(i: number) { return `http://127.0.0.1:${this.cfg.appPorts[i]}` }

  /** Runs SQL as root over node i's socket; returns the tab-separated rows. */
  async rootSql(i: number, sql: string, timeoutMs = 10_000): Promise<string[][]> {
    const { stdout } = await run('mariadb', ['--no-defaults', `--socket=${this.socket(i)}`, '-uroot', '-N', '-B', '-e', sql], { timeout: timeoutMs })
    return stdout.split('\n').filter(Boolean).map(l => l.split('\t'))
  }

  async nodeState(i: number): Promise<{ up: boolean, size: number, state: string, ready: boolean }> {
    try {
      const rows = await this.rootSql(i, 'SHOW GLOBAL STATUS WHERE Variable_name IN (\'wsrep_cluster_size\', \'wsrep_local_state_comment\', \'wsrep_ready\')', 3000)
      const v = Object.fromEntries(rows.map(([k, val]) => [k, val]))
      return { up: true, size: Number(v.wsrep_cluster_size ?? 0), state: v.wsrep_local_state_comment ?? '?', ready: v.wsrep_ready === 'ON' }
    }
    catch {
      return { up: false, size: 0, state: 'down', ready: false }
    }
  }

  private prepareDir(i: number) {
    const d = this.nodeDir(i)
    mkdirSync(join(d, 'db'), { recursive: true })
    mkdirSync(join(d, 'run'), { recursive: true })
    // The nodes run as the mysql user: the rsync state transfer writes as that user (see DEVELOPERS.md, Galera).
    for (const p of [d, join(d, 'db'), join(d, 'run')]) chownSync(p, mysqlUid(), mysqlGid())
    chmodSync(d, 0o755)
  }

  private grastate(i: number): { seqno: number, safeToBootstrap: boolean } | null {
    const f = join(this.nodeDir(i), 'db', 'grastate.dat')
    if (!existsSync(f)) return null
    const text = readFileSync(f, 'utf8')
    return {
      seqno: Number(/seqno:\s*(-?\d+)/.exec(text)?.[1] ?? -1),
      safeToBootstrap: /safe_to_bootstrap:\s*1/.test(text),
    }
  }

  /** Starts node i's mariadbd (bootstrap = the first node of a new cluster). Resolves when it answers as Synced. */
  async startNode(i: number, opts: { bootstrap?: boolean, waitMs?: number } = {}) {
    if (this.nodes[i]) throw new Error(`node ${i + 1} is already running`)
    this.prepareDir(i)
    const d = this.nodeDir(i)
    const g = this.galeraPort(i)
    const args = [
      '--no-defaults', '--user=mysql', `--datadir=${d}/db`, `--socket=${this.socket(i)}`, `--pid-file=${d}/run/p.pid`,
      `--port=${this.cfg.dbPorts[i]}`, '--bind-address=127.0.0.1', '--skip-name-resolve', `--log-error=${d}/err.log`,
      // Small: three nodes share a 2-core machine with other work.
      '--innodb-buffer-pool-size=32M', '--innodb-log-file-size=16M', '--performance-schema=OFF', '--max-connections=120',
      '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
      '--binlog-format=ROW', '--innodb-autoinc-lock-mode=2', '--default-storage-engine=InnoDB',
      // The migrations create triggers (0006 to 0008: they only count changes) as the app's user, which MariaDB refuses
      // without SUPER where the binary log is on, as on a Galera node, unless this is set.
      '--log-bin-trust-function-creators=1',
      // Durability comes from the other nodes holding every committed write set (common Galera practice).
      '--innodb-flush-log-at-trx-commit=2',
      '--wsrep-on=ON', '--wsrep-provider=/usr/lib/galera/libgalera_smm.so', '--wsrep-cluster-name=veerline',
      `--wsrep-node-name=n${i + 1}`, `--wsrep-node-address=127.0.0.1:${g}`,
      `--wsrep-cluster-address=${this.gcommAddress()}`,
      `--wsrep-provider-options=gmcast.listen_addr=tcp://127.0.0.1:${g};ist.recv_addr=127.0.0.1:${this.cfg.istPorts[i]};gcache.size=64M`,
      `--wsrep-sst-receive-address=127.0.0.1:${this.cfg.sstPorts[i]}`, '--wsrep-sst-method=rsync',
    ]
    if (opts.bootstrap) args.push('--wsrep-new-cluster')
    const out = openSync(join(d, 'stdout.log'), 'a')
    const child = spawn('/usr/sbin/mariadbd', args, { stdio: ['ignore', out, out], detached: true })
    this.nodes[i] = { child, name: `n${i + 1}` }
    child.once('exit', (code, signal) => {
      if (this.nodes[i]?.child === child) this.nodes[i] = null
      if (!this.stopping) log(`node n${i + 1} exited (${signal ?? code})`)
    })
    await this.waitSynced(i, opts.waitMs ?? 120_000)
  }

  async waitSynced(i: number, timeoutMs: number) {
    const deadline = Date.now() + timeoutMs
    while (Date.now() < deadline) {
      if (!this.nodes[i]) throw new Error(`node n${i + 1} stopped while starting: see ${this.nodeDir(i)}/err.log`)
      const s = await this.nodeState(i)
      if (s.up && s.ready && s.state === 'Synced') return s
      await sleep(300)
    }
    throw new Error(`node n${i + 1} was not Synced within ${timeoutMs} ms: see ${this.nodeDir(i)}/err.log`)
  }

  /** kill -9 of node i (no clean shutdown). Resolves when the process is gone. */
  async killNode(i: number) {
    const p = this.nodes[i]
    if (!p) return
    const gone = new Promise(r => p.child.once('exit', r))
    p.child.kill('SIGKILL')
    await gone
  }

  /** A clean shutdown of node i (SIGTERM; mariadbd shuts down cleanly on it). */
  async stopNode(i: number, timeoutMs = 60_000) {
    const p = this.nodes[i]
    if (!p) return
    const gone = new Promise(r => p.child.once('exit', r))
    p.child.kill('SIGTERM')
    const t = setTimeout(() => p.child.kill('SIGKILL'), timeoutMs)
    await gone
    clearTimeout(t)
  }

  /**
   * Starts the three nodes: a new cluster when there is no data (node 1 bootstraps, the others join by state
   * transfer), otherwise from the node that stopped last (grastate.dat says safe_to_bootstrap), or the highest seqno.
   */
  async startDatabase(fresh = false) {
    if (fresh) for (const i of [0, 1, 2]) rmSync(this.nodeDir(i), { recursive: true, force: true })
    const states = [0, 1, 2].map(i => this.grastate(i))
    let first = 0
    if (!existsSync(join(this.nodeDir(0), 'db', 'mysql'))) {
      for (const i of [0, 1, 2]) rmSync(this.nodeDir(i), { recursive: true, force: true })
      this.prepareDir(0)
      log('initialising node n1 (the others join by state transfer)')
      await run('mariadb-install-db', ['--no-defaults', '--user=mysql', `--datadir=${this.nodeDir(0)}/db`,
        '--auth-root-authentication-method=socket', '--skip-test-db'], { timeout: 120_000 })
    }
    else {
      const safe = states.findIndex(s => s?.safeToBootstrap)
      if (safe >= 0) first = safe
      else {
        // Nobody stopped last cleanly (all were killed): take the highest seqno and mark it safe.
        first = states.reduce((best, s, i) => ((s?.seqno ?? -1) > (states[best]?.seqno ?? -1) ? i : best), 0)
        const f = join(this.nodeDir(first), 'db', 'grastate.dat')
        if (existsSync(f)) writeFileSync(f, readFileSync(f, 'utf8').replace(/safe_to_bootstrap:\s*0/, 'safe_to_bootstrap: 1'))
      }
    }
    log(`starting node n${first + 1} (bootstraps the cluster) on 127.0.0.1:${this.cfg.dbPorts[first]}`)
    await this.startNode(first, { bootstrap: true })
    await this.rootSql(first, `CREATE DATABASE IF NOT EXISTS \`${this.cfg.dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
      CREATE USER IF NOT EXISTS 'veerline'@'127.0.0.1' IDENTIFIED BY '${this.dbPassword}';
      ALTER USER 'veerline'@'127.0.0.1' IDENTIFIED BY '${this.dbPassword}';
      GRANT ALL PRIVILEGES ON \`${this.cfg.dbName}\`.* TO 'veerline'@'127.0.0.1';`)
    for (const i of [0, 1, 2].filter(n => n !== first)) {
      log(`starting node n${i + 1} on 127.0.0.1:${this.cfg.dbPorts[i]} (joins by state transfer)`)
      await this.startNode(i)
    }
    const s = await this.nodeState(first)
    log(`Galera cluster size ${s.size}, all nodes Synced`)
  }

  standinEnv() {
    return {
      ...process.env,
      VEERLINE_DATA_DIR: this.cfg.dataDir,
      VEERLINE_SMTP_PORT: String(this.cfg.smtpPort),
      VEERLINE_PUSH_PORT: String(this.cfg.pushPort),
    }
  }

  async startStandins() {
    for (const name of ['smtp', 'push'] as const) {
      if (this.standins[name]) continue
      const out = openSync(join(this.cfg.dataDir, `standin-${name}.log`), 'a')
      // node --import tsx, not the tsx command: the PID kept is the stand-in's own, so signals reach it.
      const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, `scripts/standins/${name}.ts`)], { cwd: ROOT, env: this.standinEnv(), stdio: ['ignore', out, out], detached: true })
      this.standins[name] = { child, name }
      child.once('exit', () => {
        if (this.standins[name]?.child === child) this.standins[name] = null
      })
    }
    for (const name of ['smtp', 'push']) {
      await run(join(ROOT, 'node_modules/.bin/tsx'), [join(ROOT, 'scripts/standins/wait.ts'), name], { cwd: ROOT, env: this.standinEnv(), timeout: 30_000 })
    }
  }

  appEnv(i: number): NodeJS.ProcessEnv {
    return {
      ...this.standinEnv(),
      NODE_ENV: process.env.NODE_ENV,
      DATABASE_URL: this.databaseUrl(i % 3),
      NUXT_SESSION_PASSWORD: this.sessionPassword,
      NUXT_PUBLIC_APP_URL: this.appUrl(i),
      NUXT_TELEMETRY_DISABLED: '1',
      HOST: '127.0.0.1', PORT: String(this.cfg.appPorts[i]),
      NITRO_HOST: '127.0.0.1', NITRO_PORT: String(this.cfg.appPorts[i]),
      VEERLINE_INSTANCE: `app${i + 1}`, VEERLINE_INSTANCE_ID: `app${i + 1}`,
    }
  }

  /** Applies the migrations from every instance at once: the lock row in scripts/db-setup.ts lets one through. */
  async migrate() {
    const results = await Promise.all(this.cfg.appPorts.map((_, i) =>
      run(join(ROOT, 'node_modules/.bin/tsx'), [join(ROOT, 'scripts/db-setup.ts')], { cwd: ROOT, env: this.appEnv(i), timeout: 180_000 })))
    results.forEach((r, i) => log(`db-setup from app${i + 1}: ${r.stdout.trim().split('\n').join(' | ')}`))
  }

  async build() {
    if (process.env.VEERLINE_SKIP_BUILD === '1' && existsSync(join(ROOT, '.output/server/index.mjs'))) return
    log('building (nuxt build)')
    await run(join(ROOT, 'node_modules/.bin/nuxt'), ['build'], { cwd: ROOT, env: { ...process.env, NUXT_TELEMETRY_DISABLED: '1' }, timeout: 600_000, maxBuffer: 64 << 20 })
  }

  async startApp(i: number, extraEnv: Record<string, string> = {}) {
    if (this.apps[i]) throw new Error(`app${i + 1} is already running`)
    const out = openSync(join(this.cfg.dataDir, `app${i + 1}.log`), 'a')
    const child = spawn(process.execPath, [join(ROOT, '.output/server/index.mjs')], { cwd: ROOT, env: { ...this.appEnv(i), ...extraEnv }, stdio: ['ignore', out, out], detached: true })
    this.apps[i] = { child, name: `app${i + 1}` }
    child.once('exit', (code, signal) => {
      if (this.apps[i]?.child === child) this.apps[i] = null
      if (!this.stopping) log(`app${i + 1} exited (${signal ?? code})`)
    })
    const deadline = Date.now() + 60_000
    while (Date.now() < deadline) {
      if (!this.apps[i]) throw new Error(`app${i + 1} stopped at start-up: see ${this.cfg.dataDir}/app${i + 1}.log`)
      try {
        if ((await fetch(`${this.appUrl(i)}/healthz`, { signal: AbortSignal.timeout(2000) })).ok) return
      }
      catch { /* not yet */ }
      await sleep(200)
    }
    throw new Error(`app${i + 1} did not answer on ${this.appUrl(i)}`)
  }

  async killApp(i: number, signal: NodeJS.Signals = 'SIGKILL') {
    const p = this.apps[i]
    if (!p) return
    const gone = new Promise(r => p.child.once('exit', r))
    p.child.kill(signal)
    await gone
  }

  /** Signals the SMTP stand-in: SIGUSR1 stops listening (a mail server that is down), SIGUSR2 listens again. */
  smtpListening(on: boolean) {
    this.standins.smtp?.child.kill(on ? 'SIGUSR2' : 'SIGUSR1')
  }

  async stopAll() {
    this.stopping = true
    await Promise.all(this.apps.map((_, i) => this.killApp(i, 'SIGTERM')))
    for (const name of ['smtp', 'push'] as const) {
      const p = this.standins[name]
      if (p) {
        const gone = new Promise(r => p.child.once('exit', r))
        p.child.kill('SIGTERM')
        await gone
      }
    }
    // One node after the other, so that the last one is marked safe to bootstrap the next start.
    for (const i of [2, 1, 0]) await this.stopNode(i)
  }
}

const mysqlUid = () => idOf('-u')
const mysqlGid = () => idOf('-g')
const ids: Record<string, number> = {}
function idOf(flag: string) {
  if (ids[flag] === undefined) {
    const passwd = readFileSync('/etc/passwd', 'utf8').split('\n').find(l => l.startsWith('mysql:'))
    if (!passwd) throw new Error('no mysql user: install mariadb-server (Debian makes the user)')
    const [, , uid, gid] = passwd.split(':')
    ids['-u'] = Number(uid)
    ids['-g'] = Number(gid)
  }
  return ids[flag]!
}

export function isRoot() {
  return process.getuid?.() === 0
}

export function assertDir(path: string) {
  return existsSync(path) && statSync(path).isDirectory()
}
