import type { CaseListItem, RefrigerantTransactionDto } from './cases'
import type { RefrigerantSafetyDto, UnitDto } from './equipment-dto'
import type { UploadDto } from './uploads'

/** `GET /api/units/{id}/overview`: the unit with its history. */
export interface UnitOverviewDto {
  unit: UnitDto
  refrigerants: RefrigerantSafetyDto[]
  openCases: CaseListItem[]
  pastCases: CaseListItem[]
  pastCaseTotal: number
  transactions: RefrigerantTransactionDto[]
  uploads: UploadDto[]
  nameplate: UploadDto | null
}
