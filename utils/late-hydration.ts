import { defineAsyncComponent, defineComponent, h, onBeforeUnmount, ref, watch, type Component, type HydrationStrategy } from 'vue'

/** The parts on the page not hydrated yet: `now()` hydrates one at once, `mounted` settles once it has. */
const waiting = new Set<{ now: () => void, mounted: Promise<void> }>()

/**
 * Hydrates at once every part not hydrated yet and settles when they all have. For a change of shared state the
 * parts read themselves (the reader's units): a part hydrating after such a change would meet markup drawn for the
 * old state (Vue reports a hydration mismatch and leaves stale attributes), and until then it shows the old state.
 * Call this first, then change the state.
 */
export function hydrateLatePartsNow(): Promise<void> {
  const all = [...waiting]
  for (const part of all) part.now()
  return Promise.all(all.map(p => p.mounted)).then(() => {})
}

/**
 * A part of a page that the server renders as usual but whose code loads, and which hydrates, later: when `strategy`
 * says so (Vue's hydrateOnIdle(ms), hydrateOnVisible()), like Nuxt's Lazy… components with hydrate-on-…, with one
 * difference. Vue cannot hydrate a lazily hydrated part once its props have changed: it drops the server's markup and
 * draws the part anew when its code is in, so a live update arriving before then blanks the part meanwhile (and in
 * development warns "Skipping lazy hydration"). Here the part keeps the props it was rendered with until it has
 * hydrated; a change before then hydrates it at once (its code is fetched then), and the new props follow as an
 * ordinary update. Listeners and attributes pass through like props.
 *
 * `file`: the part's path from the project root, as the server render records the modules it used; the page does
 * not preload it (nor the chunks only it imports: the build:manifest hook in nuxt.config.ts).
 */
export function lateHydrated<C extends Component>(file: string, loader: () => Promise<{ default: C }>, strategy: HydrationStrategy): C {
  // The part's own code: fetched only when the outer wrapper below renders it, i.e. when it hydrates.
  const part = defineAsyncComponent({ loader })
  return defineComponent({
    name: 'LateHydrated',
    inheritAttrs: false,
    setup(_, { attrs }) {
      if (import.meta.server) {
        useNuxtApp().hook('app:rendered', ({ ssrContext }) => {
          ssrContext?.modules?.delete(file)
        })
      }
      const hydrated = ref(false)
      let hydrateNow: (() => void) | null = null
      let settle = () => {}
      const entry = { now: () => hydrateNow?.(), mounted: new Promise<void>(resolve => (settle = resolve)) }
      const outer = defineAsyncComponent({
        loader: () => Promise.resolve(part),
        hydrate(hydrate, forEachElement) {
          let done = false
          let stopStrategy: (() => void) | undefined
          waiting.add(entry)
          hydrateNow = () => {
            if (done) return
            done = true
            hydrateNow = null
            stopStrategy?.()
            hydrate()
          }
          const teardown = strategy(hydrateNow, forEachElement)
          if (typeof teardown === 'function') {
            if (done) teardown()
            else stopStrategy = teardown
          }
          return () => {
            hydrateNow = null
            stopStrategy?.()
          }
        },
      })
      // Fires when the part itself is in the page: hydrated, or drawn in the browser after a client-side navigation.
      const onVnodeMounted = () => {
        hydrated.value = true
        waiting.delete(entry)
        settle()
      }
      onBeforeUnmount(() => {
        waiting.delete(entry)
        settle()
      })
      // The same object on every render before hydration, so Vue sees no change to patch.
      const asRendered = { ...attrs, onVnodeMounted }
      watch(() => ({ ...attrs }), () => hydrateNow?.(), { flush: 'post' })
      return () => h(outer, hydrated.value ? { ...attrs, onVnodeMounted } : asRendered)
    },
  }) as unknown as C
}
