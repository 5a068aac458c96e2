// Mounts the "uploads" storage before the first request, from runtime config (see
// server/utils/upload-storage.ts for the drivers and their settings).
export default defineNitroPlugin(() => {
  const config = useRuntimeConfig()
  useStorage().mount('uploads', uploadDriverFrom({ uploadDriver: config.uploadDriver, uploadDir: config.uploadDir, s3: config.s3 }))
})
