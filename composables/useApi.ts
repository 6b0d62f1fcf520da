// useFetch over the app's API client (plugins/api.ts): SSR-safe reads with the route's own return type, the
// 401 handling and the contract's errors. Writes call `useNuxtApp().$api` in an action, then `refresh()`.
export const useApi = createUseFetch(() => ({ $fetch: useNuxtApp().$api }))
