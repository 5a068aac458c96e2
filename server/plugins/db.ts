// Opens the database at start-up so every model is registered before the first request.
export default defineNitroPlugin(() => {
  useDb()
})
