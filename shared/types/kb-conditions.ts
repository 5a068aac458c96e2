// Operators of a finding's conditions: json-rules-engine's own and Rimecase's range operators. The
// knowledge-base schemas (server) and the condition editor (app) both read this list.

export const NUMERIC_OPERATORS = ['lessThan', 'lessThanInclusive', 'greaterThan', 'greaterThanInclusive'] as const
export const RANGE_OPERATORS = ['between', 'outside', 'withinPercent', 'outsidePercent'] as const
export const CONDITION_OPERATORS = ['equal', 'notEqual', 'in', 'notIn', ...NUMERIC_OPERATORS, ...RANGE_OPERATORS] as const
export type OperatorName = (typeof CONDITION_OPERATORS)[number]
