import type { PressureReading } from '#shared/utils/charging/readings'
import type { AnyPressureUnit, RefrigerantInfo, StandingPhase, TemperatureUnit } from '#shared/utils/properties'

/** A refrigerant as `GET /api/refrigerants` returns it (contract fields plus the catalogue's extras). */
export type RefrigerantDto = RefrigerantInfo

/** The reading as the caller typed it, when it came with a unit (`?pressure=15&unit=psig`); gauge units name the atmosphere used. */
export interface SaturationInput {
  value: number
  unit: AnyPressureUnit | TemperatureUnit
  atmosphericKpa?: number
  altitudeM?: number
}

interface SaturationBase {
  designation: string
  kind: 'pure' | 'blend'
  input?: SaturationInput
}

/** Saturation pressure at a temperature: one pressure for a pure fluid, bubble and dew for a blend. */
export type SaturationAtTemperatureDto = SaturationBase & { temperatureC: number } & (
  | { pressureKpa: number }
  | { bubblePressureKpa: number; dewPressureKpa: number }
)

/** Saturation temperature at an absolute pressure: one for a pure fluid, bubble, dew and glide for a blend. */
export type SaturationAtPressureDto = SaturationBase & { pressureKpa: number } & (
  | { temperatureC: number }
  | { bubbleTemperatureC: number; dewTemperatureC: number; glideK: number }
)

export type SaturationDto = SaturationAtTemperatureDto | SaturationAtPressureDto

interface StandingBase {
  designation: string
  ambientC: number
  phase: StandingPhase
  note: string
  /** Dangers first: liquid-full, above the design pressure, far above the critical pressure. */
  warnings: string[]
  densityKgM3: number
  /** Rise of this fill's standing pressure per kelvin of ambient, kPa/K. */
  kpaPerK: number
  /** The standing pressure in the caller's unit (`unit`, gauge at `altitudeM`; kPag at sea level by default). */
  reading: PressureReading
  saturationPressureKpa?: number
  saturatedLiquidDensityKgM3?: number
  warmAboveC?: number
  liquidFullAboveC?: number
  /** The stage's design pressure (absolute kPa) when one was given, and the ambient at which this fill reaches it. */
  designPressureKpa?: number
  reachesDesignPressureAtC?: number
  cautions: string[]
}

/** `POST /api/calculations/standing-pressure` with a charge: the pressure it stands at. */
export interface StandingFromChargeDto extends StandingBase {
  mode: 'charge'
  volumeL: number
  chargeG: number
  pressureKpa: number
}

/** With a measured pressure: the charge it implies (a lower bound when liquid is present). */
export interface StandingFromPressureDto extends StandingBase {
  mode: 'pressure'
  volumeL: number
  pressureKpa: number
  chargeG: number
  chargeIsMinimum: boolean
  /** The pressure as typed, when it came as `pressure` + `unit`. */
  input?: { value: number; unit: AnyPressureUnit; atmosphericKpa: number }
}

/** With a reference reading: the same fill carried to a new ambient (isochoric shift). */
export interface StandingShiftDto extends StandingBase {
  mode: 'shift'
  referencePressureKpa: number
  referenceAmbientC: number
  pressureKpa: number
  chargeG?: number
  volumeL?: number
}

export type StandingDto = StandingFromChargeDto | StandingFromPressureDto | StandingShiftDto

/** `GET /api/conversions/measurement`: one reading in another measurement unit; gauge pressures name the atmosphere used. */
export type MeasurementConversionDto =
  | { kind: 'pressure'; value: number; from: AnyPressureUnit; to: AnyPressureUnit; result: number; atmosphericKpa: number }
  | { kind: 'temperature'; value: number; from: TemperatureUnit; to: TemperatureUnit; result: number }
