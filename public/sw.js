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
  event.waitUntil(self.registration.showNotification(data.title || 'Veerline alert', {
    body, tag: data.deliveryId ? `veerline-${data.deliveryId}` : undefined, data: { url: data.url || '/alerts' },
  }))
})

self.addEventListener('notificationclick', (event) => {
  event.notification.close()
  const url = (event.notification.data && event.notification.data.url) || '/alerts'
  event.waitUntil(self.clients.openWindow(url))
})
