import apiRoutes from '#veerline/api-routes'

// Nitro's router lets a request through to the page renderer (a 302 to /sign-in) when a path under /api has no
// route file for its method; a catch-all route file under server/api is not reached in that case (measured). So this
// middleware answers first: 405 with `Allow` for a known path and a method it lacks (OPTIONS included), 404 for an
// unknown path. Matching requests go on to their route as usual.
const patterns = apiRoutes
  .filter(r => !r.route.includes('*'))
  .map(r => ({
    method: r.method ? r.method.toUpperCase() : null,
    re: new RegExp(`^${r.route.split('/').map(part => (part.startsWith(':') ? '[^/]+' : part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'))).join('/')}/?$`),
  }))

function allowedMethods(path: string): string[] | 'any' {
  const found = new Set<string>()
  for (const p of patterns) {
    if (!p.re.test(path)) continue
    if (!p.method) return 'any'
    found.add(p.method)
  }
  return [...found].sort()
}

export default defineEventHandler((event) => {
  const path = event.path.split('?')[0]!
  if (path !== '/api' && !path.startsWith('/api/')) return
  const allowed = allowedMethods(path)
  if (allowed === 'any') return
  if (!allowed.length) throw createError({ statusCode: 404, statusMessage: `There is no API route at ${path}` })
  const method = event.method.toUpperCase()
  if (allowed.includes(method) || (method === 'HEAD' && allowed.includes('GET'))) return
  setResponseHeader(event, 'Allow', allowed.join(', '))
  throw createError({ statusCode: 405, statusMessage: `${method} is not allowed on ${path}; it answers ${allowed.join(', ')}` })
})
