// Waits (up to 20 s) until the named stand-in answers: `tsx scripts/standins/wait.ts smtp|push`.
import { connect } from 'node:net'
import { pushPort, smtpPort } from './lib/common'

const name = process.argv[2]
const deadline = Date.now() + 20_000

function smtpReady() {
  return new Promise<boolean>((resolve) => {
    const socket = connect(smtpPort(), '127.0.0.1')
    socket.setTimeout(1000)
    socket.once('data', (d) => {
      socket.destroy()
      resolve(d.toString().startsWith('220'))
    })
    socket.once('error', () => resolve(false))
    socket.once('timeout', () => {
      socket.destroy()
      resolve(false)
    })
  })
}

async function pushReady() {
  try {
    return (await fetch(`http://127.0.0.1:${pushPort()}/healthz`, { signal: AbortSignal.timeout(1000) })).ok
  }
  catch {
    return false
  }
}

const probes: Record<string, () => Promise<boolean>> = { smtp: smtpReady, push: pushReady }
// Started without a name (scripts/lib/app.sh starts every scripts/standins/*.ts): nothing to wait for.
if (!name || name === 'wait') process.exit(0)
const probe = probes[name]
if (!probe) {
  console.error(`unknown stand-in "${name}" (known: smtp, push)`)
  process.exit(2)
}
while (!(await probe())) {
  if (Date.now() > deadline) {
    console.error(`the ${name} stand-in did not answer within 20 s`)
    process.exit(1)
  }
  await new Promise(r => setTimeout(r, 150))
}
