// Marks the page as interactive once Vue has hydrated it (html[data-hydrated]). Until then a form
// typed into would be reset by hydration; browser tests wait for this mark before typing.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.hook('app:suspense:resolve', () => {
    document.documentElement.dataset.hydrated = 'true'
  })
})
