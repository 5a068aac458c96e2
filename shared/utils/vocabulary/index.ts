/**
 * People's words for every machine word of Rimecase: stages, quantities, measurement units,
 * causes, tests and their outcomes, symptoms, roles, states and timeline events, each in a short and
 * a long form. Pages, the timeline, the service report, its PDF and e-mail and error messages all
 * use these; the API keeps its own words.
 */
export { humanise, labelOf, type WordEntry, type WordForm, type WordLabel } from './words'
export { STAGE_WORDS, stageLabel, stageList } from './stages'
export { QUANTITY_WORDS, quantityLabel, readingName } from './quantities'
export {
  MEASUREMENT_UNIT_WORDS, PRESSURE_UNIT_WORDS, TEMPERATURE_UNIT_WORDS, isGaugeUnit, measurementSymbol, measurementUnitLabel,
  type MeasurementUnitWord,
} from './measurement-units'
export { SYMPTOM_WORDS, symptomLabel } from './symptoms'
export { CAUSE_WORDS, causeLabel, hypothesisLabel } from './causes'
export { TEST_WORDS, outcomeLabel, testLabel, type TestWordEntry } from './tests'
export { ROLE_WORDS, roleLabel } from './roles'
export {
  CASE_STATE_WORDS, DIRECTION_WORDS, EMAIL_STATE_WORDS, JOB_STATE_WORDS, UPLOAD_PURPOSE_WORDS, caseStateLabel, directionLabel, emailStateLabel,
  jobStateLabel, uploadPurposeLabel,
} from './states'
export { EQUIPMENT_CLASS_WORDS, METERING_DEVICE_WORDS, UNIT_KIND_WORDS, equipmentClassLabel, meteringDeviceLabel, unitKindLabel } from './equipment'
export { EVENT_WORDS, causeOnStage, eventDetail, eventLabel } from './events'
export { FIELD_WORDS, fieldMessage, fieldName } from './fields'
export { inPlainWords, labelOfApiWord } from './text'
export { NO_TITLES, type KnowledgeBaseTitles } from './titles'
export { NAMEPLATE_BASIS_WORDS, STANDING_PHASE_WORDS, SUBSTITUTION_BASIS_WORDS } from './charging'
export {
  ADDITION_PURPOSE_WORDS, CHECK_KIND_WORDS, CYLINDER_PURPOSE_WORDS, DUTY_KIND_WORDS, additionPurposeLabel, applianceTypeLabel, checkKindLabel,
  cylinderPurposeLabel, dutyKindLabel,
} from './compliance'
export { KB_AUDIT_ACTION_WORDS, KB_VERSION_STATUS_WORDS, kbAuditActionLabel, kbVersionStatusLabel } from './knowledge'
export {
  CONFIRMATION_BASIS_WORDS, HOLD_GAS_WORDS, HOT_WORK_CHECK_WORDS, READING_PHASE_WORDS, RECHARGE_METHOD_WORDS, REPAIR_STEP_WORDS, STEP_VERDICT_WORDS,
  repairStepLabel,
} from './repair-steps'
