/**
 * Shared helpers of the diagnosis tests: the seed knowledge base from content-src, and pressures
 * from the property module's saturation curves so that a test states temperatures the way a
 * technician thinks about them.
 */
import { join } from 'node:path'
import { saturationPressure, type Designation } from '#shared/utils/properties'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'

let seed: KnowledgeBase | undefined
export function seedKb(): KnowledgeBase {
  seed ??= { ...loadKnowledgeBaseFromDirectory(join(process.cwd(), 'content-src')), version: { id: 'seed-test', label: 'seed', status: 'draft' } }
  return seed
}

export const satKpa = (d: Designation, tC: number): number => saturationPressure(d, tC).dewKpa
