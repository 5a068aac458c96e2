// The browser build imports zod through this module (an alias in nuxt.config.ts). Zod probes for
// `new Function` when it builds an object schema, and the content security policy forbids eval; the
// probe itself is a policy violation even though zod catches the error. Schemas are built as their
// modules load, before any plugin runs, so the switch is thrown here, ahead of every schema module.
import { z } from 'zod/v4'

z.config({ jitless: true })

export * from 'zod/v4'
export { z, z as default }
