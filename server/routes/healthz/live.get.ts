// Liveness for load balancers: answers as long as the process serves requests. No database, no session.
// Readiness (the database answers too) is /healthz.
export default defineEventHandler((event) => {
  setResponseHeader(event, 'cache-control', 'no-store')
  return { status: 'ok' }
})
