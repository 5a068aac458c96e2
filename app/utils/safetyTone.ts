/**
 * The one colour rule for ASHRAE 34 safety classes everywhere in Rimecase: higher toxicity (B) or
 * flammable (2, 3) reads as danger, lower flammability (2L) as caution, class A1 as neutral. The
 * words beside the colour always say the same.
 */
export function safetyClassTone(safetyClass: string): 'danger' | 'caution' | 'neutral' {
  const toxic = safetyClass.startsWith('B')
  const flammability = safetyClass.slice(1)
  if (toxic || flammability === '2' || flammability === '3') return 'danger'
  if (flammability === '2L') return 'caution'
  return 'neutral'
}
