// npm run cluster: 3 MariaDB Galera nodes on loopback, 2 or 3 app instances (each on its own node first), the mail
// and push stand-ins; prints the addresses. Ctrl-C (or SIGTERM) stops all of it. `-- --fresh` starts from empty data.
// The children run in process groups of their own, so Ctrl-C reaches only this script, which stops them in order.
import { Cluster, isRoot, log } from './cluster-lib'

if (!isRoot()) {
  console.error('npm run cluster starts mariadbd as the mysql user and so must run as root')
  process.exit(1)
}

const cluster = new Cluster()
const cfg = cluster.cfg
let stopping: Promise<void> | null = null
async function stop(code: number) {
  if (!stopping) {
    log('stopping the apps, the stand-ins and the nodes')
    stopping = cluster.stopAll()
  }
  await stopping
  log('stopped')
  process.exit(code)
}
process.on('SIGINT', () => void stop(0))
process.on('SIGTERM', () => void stop(0))

try {
  await cluster.startDatabase(process.argv.includes('--fresh'))
  await cluster.migrate()
  await cluster.build()
  await cluster.startStandins()
  await Promise.all(cfg.appPorts.map((_, i) => cluster.startApp(i)))
  log('Veerline on a Galera cluster:')
  cfg.dbPorts.forEach((p, i) => log(`  node n${i + 1}   mysql://127.0.0.1:${p}  (Galera 127.0.0.1:${cluster.galeraPort(i)}, data ${cluster.nodeDir(i)})`))
  cfg.appPorts.forEach((_, i) => log(`  app${i + 1}      ${cluster.appUrl(i)}  (DATABASE_URL hosts ${cluster.databaseUrl(i % 3).split('@')[1]})`))
  log(`  SMTP stand-in  127.0.0.1:${cfg.smtpPort}; push stand-in http://127.0.0.1:${cfg.pushPort}`)
  log(`  logs in ${cfg.dataDir}; press Ctrl-C to stop everything`)
}
catch (err) {
  console.error(`[cluster] ${(err as Error).message}`)
  await stop(1)
}
// Stay up until a signal arrives.
setInterval(() => {}, 1 << 30)
