import { execFileSync, spawnSync } from 'node:child_process'
import { describe, expect, it } from 'vitest'

// The start command's production rules: no made-up session password, no demo users.
describe('production start rules', () => {
  it('refuses to start with NODE_ENV=production and no session password, saying why', () => {
    const env = { ...process.env, NODE_ENV: 'production', NUXT_SESSION_PASSWORD: '', VEERLINE_DATA_DIR: '/tmp/veerline-prod-refusal' }
    const run = spawnSync('bash', ['scripts/start.sh'], { env, encoding: 'utf8', timeout: 30_000 })
    expect(run.status).not.toBe(0)
    expect(run.stderr + run.stdout).toMatch(/NODE_ENV=production: set NUXT_SESSION_PASSWORD/)
  })

  it('migrates a production database without seeding demo users', () => {
    const socket = process.env.MARIADB_SOCKET
    const url = process.env.DATABASE_URL
    expect(socket, 'scripts/test.sh exports the MariaDB socket').toBeTruthy()
    expect(url).toBeTruthy()
    const root = (sql: string) => execFileSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-N', '-e', sql], { encoding: 'utf8' })
    const user = new URL(url!).username
    root(`DROP DATABASE IF EXISTS veerline_prodcheck; CREATE DATABASE veerline_prodcheck; GRANT ALL ON veerline_prodcheck.* TO '${user}'@'127.0.0.1'`)
    try {
      const prodUrl = new URL(url!)
      prodUrl.pathname = '/veerline_prodcheck'
      const out = execFileSync('node_modules/.bin/tsx', ['scripts/db-setup.ts'], {
        env: { ...process.env, NODE_ENV: 'production', DATABASE_URL: prodUrl.toString() }, encoding: 'utf8', timeout: 60_000,
      })
      expect(out).toMatch(/not seeded/)
      expect(root('SELECT COUNT(*) FROM veerline_prodcheck.users').trim()).toBe('0')
      expect(root('SELECT COUNT(*) FROM veerline_prodcheck.airfields').trim()).toBe('0')
    }
    finally {
      root('DROP DATABASE IF EXISTS veerline_prodcheck')
    }
  })
})
