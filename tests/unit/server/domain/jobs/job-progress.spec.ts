import { describe, expect, it } from 'vitest'
import { isProgressWorthSaving, isUuid } from '#server/domain/jobs/job-progress'

describe('job progress', () => {
  it('saves the end at once and otherwise only a real step after a pause', () => {
    expect(isProgressWorthSaving(0.5, 1, 0)).toBe(true)
    expect(isProgressWorthSaving(0.5, 0.505, 1_000)).toBe(false)
    expect(isProgressWorthSaving(0.5, 0.6, 100)).toBe(false)
    expect(isProgressWorthSaving(0.5, 0.6, 300)).toBe(true)
    expect(isProgressWorthSaving(0, Number.NaN, 1_000)).toBe(false)
  })

  it('knows a job id when it sees one', () => {
    expect(isUuid('0b6f7e4c-3f1a-4c8e-9f43-5b0d2a7e9c11')).toBe(true)
    expect(isUuid('42')).toBe(false)
    expect(isUuid("0b6f7e4c-3f1a-4c8e-9f43-5b0d2a7e9c11' OR 1=1")).toBe(false)
  })
})
