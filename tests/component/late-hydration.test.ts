// Parts of a page rendered on the server whose code loads and hydrates later (utils/late-hydration.ts), against Vue's
// own server renderer and hydration (vue/server-renderer, createSSRApp) in happy-dom. The reference is Vue's
// documented lazy hydration (vuejs.org, "Lazy Hydration", Vue 3.5: defineAsyncComponent's `hydrate` option and the
// hydrateOn… strategies) and its source (runtime-core apiAsyncComponent.ts: a wrapper updated before its strategy ran
// skips hydration, "Skipping lazy hydration for component …: it was updated before lazy hydration performed", and is
// drawn anew once its code is in).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { createSSRApp, defineAsyncComponent, defineComponent, h, nextTick, ref, type Component, type HydrationStrategy } from 'vue'
import { renderToString } from 'vue/server-renderer'
import { hydrateLatePartsNow, lateHydrated } from '~/utils/late-hydration'

const units = ref<'kt' | 'mps'>('kt') // stands for the reader's units in the preferences store
let taps = 0
const Card = defineComponent({
  props: { speedKt: { type: Number, required: true } },
  setup: p => () => h('p', { 'class': 'card', 'data-unit': units.value, 'onClick': () => taps++ },
    units.value === 'kt' ? `${p.speedKt} kt` : `${(p.speedKt * 0.514444).toFixed(1)} m/s`),
})

/** A manual strategy (the test says when "idle" or "visible" comes) and a loader held until the test lets it go. */
function harness() {
  let fire = () => {}
  const strategy: HydrationStrategy = (hydrate) => {
    fire = hydrate
  }
  let release = () => {}
  const gate = new Promise<void>(r => (release = r))
  const loads = { n: 0 }
  // As an import() of the part's file answers: a module whose default export is the component.
  const module = { __esModule: true, default: Card }
  const loader = () => {
    loads.n++
    return gate.then(() => module)
  }
  return { strategy, loader, loads, fire: () => fire(), release: () => release() }
}

const warnings: string[] = []
const consoleErrors: string[] = []
let el: HTMLElement
beforeEach(() => {
  units.value = 'kt'
  taps = 0
  warnings.length = 0
  consoleErrors.length = 0
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => void consoleErrors.push(String(args[0])))
})
afterEach(() => {
  vi.restoreAllMocks()
  el?.remove()
})
const settle = async () => {
  for (let i = 0; i < 5; i++) {
    await nextTick()
    await new Promise(r => setTimeout(r, 0))
  }
}

/** Renders `part` on the "server" with speed 20 kt, then hydrates that markup in the page; `speed` drives the prop. */
async function page(serverPart: Component, clientPart: Component) {
  const speed = ref(20)
  const app = (part: Component) => createSSRApp({ setup: () => () => h('div', [h('span', `page ${speed.value}`), h(part, { speedKt: speed.value })]) })
  const html = await renderToString(app(serverPart))
  el = document.createElement('div')
  el.innerHTML = html
  document.body.appendChild(el)
  const client = app(clientPart)
  client.config.warnHandler = m => void warnings.push(m)
  client.mount(el)
  await settle()
  return { speed }
}
const mismatches = () => [...warnings, ...consoleErrors].filter(m => /mismatch|Skipping lazy hydration/i.test(m))

describe('a part hydrated later', () => {
  it('Vue alone: a prop change before hydration drops the server markup until the code is in (why lateHydrated exists)', async () => {
    const t = harness()
    const child = defineAsyncComponent({ loader: t.loader })
    const plain = defineAsyncComponent({ hydrate: t.strategy, loader: () => Promise.resolve(child) })
    const { speed } = await page(Card, plain)
    const drawn = el.querySelector('.card')
    expect(drawn?.textContent).toBe('20 kt')
    speed.value = 25
    await settle()
    expect(el.querySelector('.card')).toBeNull() // blank while the code loads
    t.release()
    await settle()
    const redrawn = el.querySelector('.card')
    expect(redrawn?.textContent).toBe('25 kt')
    expect(redrawn).not.toBe(drawn) // drawn anew, not hydrated
    t.fire() // the strategy's moment: nothing left to hydrate
    await settle()
    expect(el.querySelector('.card')).toBe(redrawn)
  })

  it('keeps its markup, hydrates at once when its props change first, then shows the new props and answers taps', async () => {
    const t = harness()
    const { speed } = await page(Card, lateHydrated('test/Card.vue', t.loader, t.strategy))
    const drawn = el.querySelector('.card')!
    expect(drawn.textContent).toBe('20 kt')
    expect(t.loads.n).toBe(0) // no code before the strategy or a change asks for it
    speed.value = 25
    await settle()
    expect(t.loads.n).toBe(1) // asked for at once
    expect(el.querySelector('.card')?.textContent).toBe('20 kt') // the server's markup stays meanwhile
    t.release()
    await settle()
    const card = el.querySelector('.card') as HTMLElement
    expect(card).toBe(drawn) // hydrated: the same element, not drawn anew
    expect(card.textContent).toBe('25 kt')
    card.click()
    expect(taps).toBe(1)
    t.fire() // the strategy's moment coming later changes nothing
    await settle()
    expect(el.querySelector('.card')?.textContent).toBe('25 kt')
    expect(mismatches()).toEqual([])
  })

  it('hydrates when its strategy says so and follows later changes', async () => {
    const t = harness()
    const { speed } = await page(Card, lateHydrated('test/Card.vue', t.loader, t.strategy))
    const drawn = el.querySelector('.card')
    t.fire()
    t.release()
    await settle()
    expect(t.loads.n).toBe(1)
    expect(el.querySelector('.card')).toBe(drawn)
    speed.value = 30
    await settle()
    expect(el.querySelector('.card')?.textContent).toBe('30 kt')
    expect(mismatches()).toEqual([])
  })

  it('hydrateLatePartsNow before a change of shared state (the units): no part meets markup drawn for the old units', async () => {
    const t = harness()
    await page(Card, lateHydrated('test/Card.vue', t.loader, t.strategy))
    const drawn = el.querySelector('.card')
    const done = hydrateLatePartsNow()
    t.release()
    await done
    units.value = 'mps'
    await settle()
    const card = el.querySelector('.card') as HTMLElement
    expect(card).toBe(drawn)
    // 20 kt in m/s: 1 kt = 1852/3600 m/s (international nautical mile, 1852 m exactly).
    expect(card.textContent).toBe(`${(20 * 1852 / 3600).toFixed(1)} m/s`)
    expect(card.dataset.unit).toBe('mps')
    expect(mismatches()).toEqual([])
    await hydrateLatePartsNow() // nothing waits any more: settles at once
  })
})
