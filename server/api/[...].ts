// Any /api path without a route answers a JSON 404 instead of the app's HTML page.
export default defineEventHandler((event) => {
  throw createError({ status: 404, statusText: 'Not Found', message: `No API route ${event.method} ${event.path}` })
})
