/**
 * The shape of a finding's conditions: json-rules-engine's all/any/not tree over fact comparisons,
 * with Rimecase's range operators. Kept apart from the knowledge-base schemas so that stage expansion
 * and the schemas can both use it without importing each other. The operator list itself is shared
 * with the app's condition editor.
 */
import { CONDITION_OPERATORS, NUMERIC_OPERATORS, RANGE_OPERATORS, type OperatorName } from '#shared/types/kb-conditions'

export { NUMERIC_OPERATORS, RANGE_OPERATORS, type OperatorName }
export const OPERATORS = CONDITION_OPERATORS

export type ConditionValue = number | string | boolean | number[] | string[]

export interface LeafCondition {
  fact: string
  operator: OperatorName
  value: ConditionValue
}
export interface AllCondition {
  all: NestedCondition[]
}
export interface AnyCondition {
  any: NestedCondition[]
}
export interface NotCondition {
  not: NestedCondition
}
export type TopCondition = AllCondition | AnyCondition | NotCondition
export type NestedCondition = LeafCondition | TopCondition
