import { z } from 'zod'

// Zod probes for `new Function` to compile faster parsers; the content security policy forbids eval,
// so in the browser it parses without compiling and never makes the probe.
export default defineNuxtPlugin({
  name: 'zod-jitless',
  enforce: 'pre',
  setup() {
    z.config({ jitless: true })
  },
})
