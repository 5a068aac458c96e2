import { UnitRegisterQuerySchema, type UnitRegisterQuery } from '#shared/schemas/equipment'
import type { UnitSort } from '#shared/types/equipment'
import type { Page, UnitDto } from '#shared/types/equipment-dto'

const DEFAULTS = UnitRegisterQuerySchema.parse({})

/**
 * The register's search, filters, order and page, kept in the address bar so that a filtered view can
 * be bookmarked or shared and the back button returns to it; the page of units comes from the API.
 */
export async function useUnitRegister() {
  const route = useRoute()
  const router = useRouter()
  const state = computed<UnitRegisterQuery>(() => {
    const parsed = UnitRegisterQuerySchema.safeParse(route.query)
    return parsed.success ? parsed.data : DEFAULTS
  })

  /** Applies a change; anything but a page change goes back to page 1. */
  function update(change: Partial<UnitRegisterQuery>) {
    const next: Partial<UnitRegisterQuery> = { ...state.value, ...change }
    if (!('page' in change)) next.page = 1
    const query: Record<string, string> = {}
    for (const [key, value] of Object.entries(next)) {
      if (value !== undefined && value !== '' && value !== DEFAULTS[key as keyof UnitRegisterQuery]) query[key] = String(value)
    }
    return router.replace({ query })
  }

  /** A header click: the same column flips direction, another column starts ascending. */
  function toggleSort(column: UnitSort) {
    const sameColumn = state.value.sort === column
    return update({ sort: column, direction: sameColumn && state.value.direction === 'asc' ? 'desc' : 'asc' })
  }

  // Awaited last: nothing after it needs the Nuxt context that an await may leave behind.
  const fetched = await useFetch('/api/equipment/units', {
    query: state,
    default: (): Page<UnitDto> => ({ items: [], total: 0, page: 1, pageSize: DEFAULTS.pageSize }),
  })
  return { state, update, toggleSort, ...fetched }
}
