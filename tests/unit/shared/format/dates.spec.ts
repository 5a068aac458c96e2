import { describe, expect, it } from 'vitest'
import { formatDate, formatDateTime, formatDuration, siteAtmosphere } from '#shared/utils/format'

describe('dates and times in one format', () => {
  it('show the moment in the given zone with the zone named', () => {
    // Central European Time is UTC+1 in winter (IANA tz database, from memory).
    expect(formatDateTime('2026-12-02T13:05:00Z', 'Europe/Berlin')).toBe('2026-12-02 14:05 CET')
    expect(formatDateTime('2026-12-02T13:05:00Z', 'UTC')).toBe('2026-12-02 13:05 UTC')
    expect(formatDate('2026-12-02T23:30:00Z', 'Europe/Berlin')).toBe('2026-12-03')
    expect(formatDateTime('2026-12-02T13:05:00Z', 'Not/AZone')).toBe('2026-12-02 13:05 UTC')
  })

  it('write durations in minutes, hours and days', () => {
    expect(formatDuration(45)).toBe('45 min')
    expect(formatDuration(125)).toBe('2 h 05 min')
    expect(formatDuration(3 * 1440 + 4 * 60)).toBe('3 d 4 h')
  })
})

describe('atmosphere at a site', () => {
  it('follows the ISO 2533 standard atmosphere and falls back to sea level', () => {
    // U.S. Standard Atmosphere, 1976 (same troposphere as ISO 2533): 84.56 kPa at 1 500 m.
    expect(siteAtmosphere(1500).kpa).toBeCloseTo(84.56, 2)
    expect(siteAtmosphere(1500).fromAltitude).toBe(true)
    expect(siteAtmosphere(undefined)).toMatchObject({ kpa: 101.325, fromAltitude: false })
    expect(siteAtmosphere(20_000)).toMatchObject({ kpa: 101.325, fromAltitude: false, source: expect.stringMatching(/outside/) })
  })
})
