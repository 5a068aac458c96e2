/**
 * The fact map being built for one rank request, with the warnings a person reads beside it.
 * Nothing that fills it throws on odd data: a property call that fails leaves its fact out and
 * says why in words, because a half-filled diagnosis is still useful on site.
 */
import type { Quantity, Stage, StageDerived } from '#shared/types/diagnosis'

export type FactValue = number | boolean | string
export type Facts = Record<string, FactValue>

export class FactSheet {
  readonly facts: Facts = {}
  readonly warnings: string[] = []
  readonly derived: Partial<Record<Stage, StageDerived>> = {}

  set(name: string, value: FactValue | undefined): void {
    if (value === undefined) return
    if (typeof value === 'number' && !Number.isFinite(value)) return
    this.facts[name] = value
  }

  drop(name: string): void {
    delete this.facts[name]
  }

  num(name: string): number | undefined {
    const v = this.facts[name]
    return typeof v === 'number' ? v : undefined
  }

  bool(name: string): boolean | undefined {
    const v = this.facts[name]
    return typeof v === 'boolean' ? v : undefined
  }

  str(name: string): string | undefined {
    const v = this.facts[name]
    return typeof v === 'string' ? v : undefined
  }

  warn(text: string): void {
    if (!this.warnings.includes(text)) this.warnings.push(text)
  }

  /** Runs a property call; a failure becomes a warning `<lead> <the property module's message> <consequence>`. */
  attempt<T>(lead: string, consequence: string, fn: () => T): T | undefined {
    try {
      const v = fn()
      return typeof v === 'number' && !Number.isFinite(v) ? undefined : v
    } catch (e) {
      this.warn(`${lead}: ${(e as Error).message} ${consequence}`)
      return undefined
    }
  }
}

/** Stage names inside a sentence ("low stage") and at its start ("Low stage"). */
export const STAGE_PHRASE: Record<Stage, string> = { high: 'high stage', low: 'low stage', single: 'system' }
export const STAGE_LEAD: Record<Stage, string> = { high: 'High stage', low: 'Low stage', single: 'System' }

/** Quantities as they read inside a sentence. */
export const QUANTITY_PHRASE: Record<Quantity, string> = {
  suctionPressure: 'suction pressure',
  dischargePressure: 'discharge pressure',
  suctionTemperature: 'suction line temperature',
  dischargeTemperature: 'discharge line temperature',
  liquidLineTemperature: 'liquid line temperature',
  evaporatorTemperature: 'evaporator temperature',
  compressorCurrent: 'compressor current',
  compressorRunning: 'compressor running state',
  standingPressure: 'standing pressure',
  cabinetTemperature: 'cabinet temperature',
  setpointTemperature: 'setpoint',
  cascadeHxTemperature: 'cascade heat exchanger temperature',
  ambientTemperature: 'room temperature',
  condenserAirInTemperature: 'condenser air-in temperature',
  condenserAirOutTemperature: 'condenser air-out temperature',
  runtime: 'runtime',
}

/** "Low stage suction pressure" / "Room temperature". */
export function readingName(quantity: Quantity, stage?: Stage): string {
  const q = QUANTITY_PHRASE[quantity]
  return stage ? `${STAGE_LEAD[stage]} ${q}` : q.charAt(0).toUpperCase() + q.slice(1)
}
