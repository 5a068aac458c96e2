/**
 * The shape of a finding's conditions: json-rules-engine's all/any/not tree over fact comparisons,
 * with Rimecase's range operators. Kept apart from the knowledge-base schemas so that stage expansion
 * and the schemas can both use it without importing each other.
 */

export const NUMERIC_OPERATORS = ['lessThan', 'lessThanInclusive', 'greaterThan', 'greaterThanInclusive'] as const
export const RANGE_OPERATORS = ['between', 'outside', 'withinPercent', 'outsidePercent'] as const
export const OPERATORS = ['equal', 'notEqual', 'in', 'notIn', ...NUMERIC_OPERATORS, ...RANGE_OPERATORS] as const
export type OperatorName = (typeof OPERATORS)[number]

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

