// App instances built from the same .output: a second instance of the suite on VEERLINE_PORT_2 (startSecondInstance,
// for what must hold across instances), and named instances on a database of their choosing with their own outbox
// worker (startInstance, for the delivery fault tests and the fan-out benchmark).
import { spawn, type ChildProcess } from 'node:child_process'
import { expect } from 'vitest'
import { ApiClient } from './api'

export type SecondInstance = { client: ApiClient, stop: () => Promise<void>, output: () => string }

/**
 * Starts the second instance (its outbox worker off, so the first instance alone sends), waits for its /healthz, and
 * signs `email` in through it. `env` adds settings for this start; `output()` is what the instance printed so far.
 */
export async function startSecondInstance(email: string, env: Record<string, string> = {}): Promise<SecondInstance> {
  const port2 = process.env.VEERLINE_PORT_2
  expect(port2, 'VEERLINE_PORT_2 is set by scripts/test.sh').toBeTruthy()
  const i = await startInstance('second', undefined, { PORT: port2!, NITRO_PORT: port2!, VEERLINE_OUTBOX_WORKER: '0', ...env })
  for (let n = 0; n < 100; n++) {
    try {
      if ((await fetch(`http://127.0.0.1:${port2}/healthz`)).ok) break
    }
    catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 200))
  }
  const client = new ApiClient(`http://127.0.0.1:${port2}`)
  await client.signIn(email)
  return {
    client,
    output: () => i.log.join(''),
    stop: async () => {
      await stopInstance(i)
    },
  }
}

export interface Instance {
  name: string
  instanceId: string
  baseUrl: string
  proc: ChildProcess
  log: string[]
  exited: Promise<{ code: number | null, signal: NodeJS.Signals | null }>
}

/**
 * Starts the built server (.output) on a free loopback port chosen by the system, on `databaseUrl`, with its outbox
 * worker named `name` (`databaseUrl` undefined: the suite's own database); `env` may set PORT/NITRO_PORT or turn the
 * worker off. Resolves once it listens (at most 30 s).
 */
export async function startInstance(name: string, databaseUrl: string | undefined, env: Record<string, string> = {}): Promise<Instance> {
  const instanceId = `${name}-${process.pid}`
  // VEERLINE_INSTANCE_NODE_ARGS: extra node flags for every instance (e.g. `--cpu-prof --cpu-prof-dir=/tmp/p` to profile a bench run).
  const nodeArgs = (process.env.VEERLINE_INSTANCE_NODE_ARGS ?? '').split(' ').filter(Boolean)
  const proc = spawn(process.execPath, [...nodeArgs, '.output/server/index.mjs'], {
    env: { ...process.env, ...(databaseUrl ? { DATABASE_URL: databaseUrl } : {}), PORT: '0', NITRO_PORT: '0', HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1',
      VEERLINE_INSTANCE_ID: instanceId, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  const log: string[] = []
  const exited = new Promise<{ code: number | null, signal: NodeJS.Signals | null }>(r => proc.once('exit', (code, signal) => r({ code, signal })))
  const baseUrl = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`instance ${name} did not listen within 30 s:\n${log.join('')}`)), 30_000)
    const onData = (chunk: Buffer) => {
      log.push(chunk.toString())
      const m = /Listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(log.join(''))
      if (m) {
        clearTimeout(timer)
        resolve(m[1]!)
      }
    }
    proc.stdout!.on('data', onData)
    proc.stderr!.on('data', (c: Buffer) => log.push(c.toString()))
    exited.then(() => reject(new Error(`instance ${name} exited at start:\n${log.join('')}`)))
  })
  return { name, instanceId, baseUrl, proc, log, exited }
}

export async function stopInstance(i: Instance, signal: NodeJS.Signals = 'SIGTERM') {
  if (i.proc.exitCode != null || i.proc.signalCode != null) return i.exited
  i.proc.kill(signal)
  const done = await Promise.race([i.exited, new Promise<null>(r => setTimeout(() => r(null), 40_000))])
  if (!done) {
    i.proc.kill('SIGKILL')
    return i.exited
  }
  return done
}
