// Writes the JSON Schema of the knowledge-base bundle, generated from its zod schema, to
// docs/knowledge-base-bundle.schema.json (`npm run kb:schema`); a unit test fails when the file is stale.
import { writeFileSync } from 'node:fs'
import { bundleJsonSchema } from '#server/domain/knowledge/bundle'

const target = new URL('../docs/knowledge-base-bundle.schema.json', import.meta.url).pathname
writeFileSync(target, `${JSON.stringify(bundleJsonSchema(), null, 2)}\n`)
console.log(`wrote ${target}`)
