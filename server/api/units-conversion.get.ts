// The first address of GET /api/conversions/measurement, kept for the scripts and loggers that call it.
export { default } from './conversions/measurement.get'
