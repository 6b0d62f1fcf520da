import { execFileSync } from 'node:child_process'
import { describe, expect, it } from 'vitest'
import { BASE_URL } from '../support/api'

function db(command: 'start' | 'stop') {
  execFileSync('bash', ['scripts/db.sh', command], { stdio: 'pipe', env: process.env, timeout: 60_000 })
}

async function live() {
  const res = await fetch(`${BASE_URL}/healthz/live`)
  return { status: res.status, body: await res.json() }
}

async function health() {
  const res = await fetch(`${BASE_URL}/healthz`)
  return { status: res.status, body: await res.json() }
}

describe('/healthz and /healthz/live', () => {
  it('is 200 with the database up, 503 with a clear message while it is down, and recovers by itself; liveness stays 200 throughout', async () => {
    expect((await health()).status).toBe(200)
    expect((await live()).status).toBe(200)
    db('stop')
    try {
      const down = await health()
      expect(down.status).toBe(503)
      expect(down.body.database.state).toBe('down')
      expect(down.body.database.message).toMatch(/database does not answer/)
      // Liveness is the process, not the database: load balancers keep the instance while MariaDB restarts.
      const alive = await live()
      expect(alive.status).toBe(200)
      expect(alive.body).toEqual({ status: 'ok' })
    }
    finally {
      db('start')
    }
    // While MariaDB comes back, a kept-alive connection from before may be closed under the client ("other side
    // closed"): that counts as not recovered yet, not as a failure.
    const healthOrDown = () => health().catch(() => ({ status: 0, body: null }))
    let last = await healthOrDown()
    for (let i = 0; i < 50 && last.status !== 200; i++) {
      await new Promise(r => setTimeout(r, 200))
      last = await healthOrDown()
    }
    expect(last.status).toBe(200)
    expect(last.body?.database.state).toBe('up')
  })
})
