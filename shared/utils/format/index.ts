/**
 * How Rimecase writes figures, pressures, dates and durations for people: the app's pages, the
 * service report, its PDF and its e-mail all use these functions and no other formatter.
 */
export { NO_FIGURE, formatCount, formatFigure, formatPercent, formatQuantity, formatReading, naturalDecimals } from './figures'
export { formatPressure } from './pressure'
export { siteAtmosphere, type SiteAtmosphere } from './atmosphere'
export { formatDate, formatDateTime, formatDuration, isTimeZone } from './dates'
