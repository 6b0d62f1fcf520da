// Built by nuxt.config.ts (nitro:init) for server/middleware/api-methods.ts: the API routes Nitro found, with their methods (null = every method).
declare module '#veerline/api-routes' {
  const routes: { route: string, method: string | null }[]
  export default routes
}
