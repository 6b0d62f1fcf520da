// Veerline service worker: shows alert pushes as notifications and opens the briefing when one is clicked.
self.addEventListener('push', (event) => {
  let data = {}
  try {
    data = event.data ? event.data.json() : {}
  }
  catch {
    data = { title: 'Veerline', body: event.data ? event.data.text() : '' }
  }
  const body = [data.body, data.caution].filter(Boolean).join('\n\n')
  // A resend carries the same deliveryId: when its notification is still shown, the copy is dropped (and the tag
  // would replace it rather than add a second one in any case).
  const tag = data.deliveryId ? `veerline-${data.deliveryId}` : undefined
  event.waitUntil((async () => {
    if (tag && (await self.registration.getNotifications({ tag })).length) return
    await self.registration.showNotification(data.title || 'Veerline alert', { body, tag, data: { url: data.url || '/alerts' } })
  })())
})

self.addEventListener('notificationclick', (event) => {
  event.notification.close()
  const url = (event.notification.data && event.notification.data.url) || '/alerts'
  event.waitUntil(self.clients.openWindow(url))
})
