// A second app instance on VEERLINE_PORT_2 (set by scripts/test.sh), built from the same .output and database, for
// tests of what must hold across instances. Its outbox worker is off so the first instance alone sends.
import { spawn, type ChildProcess } from 'node:child_process'
import { expect } from 'vitest'
import { ApiClient } from './api'

export type SecondInstance = { client: ApiClient, stop: () => Promise<void>, output: () => string }

/**
 * Starts the second instance, waits for its /healthz, and signs `email` in through it. `env` adds settings for this
 * start; `output()` is what the instance printed so far.
 */
export async function startSecondInstance(email: string, env: Record<string, string> = {}): Promise<SecondInstance> {
  const port2 = process.env.VEERLINE_PORT_2
  expect(port2, 'VEERLINE_PORT_2 is set by scripts/test.sh').toBeTruthy()
  const child: ChildProcess = spawn(process.execPath, ['.output/server/index.mjs'], {
    env: { ...process.env, PORT: port2, NITRO_PORT: port2, HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', VEERLINE_OUTBOX_WORKER: '0', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let printed = ''
  const keep = (d: Buffer) => {
    printed += d.toString()
  }
  child.stdout!.on('data', keep)
  child.stderr!.on('data', keep)
  for (let i = 0; i < 100; i++) {
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
    output: () => printed,
    stop: async () => {
      child.kill('SIGTERM')
      await new Promise(r => child.exitCode != null ? r(null) : child.once('exit', r))
    },
  }
}
