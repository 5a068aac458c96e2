/**
 * One-off generator for shared/utils/properties/data/*.ts.
 * Copies only the coefficients we use (residual Helmholtz terms, reducing state, ancillaries) out of the
 * CoolProp 8.0.0 fluid files in /work/shared/reference/eos (MIT licence) and adds the critical point of each
 * EOS, found numerically (∂p/∂ρ = ∂²p/∂ρ² = 0), because for R14 and R134a it differs from the reducing state.
 * Run: npx tsx scripts/extract-eos.ts [sourceDir]. Output is committed; the app never reads the JSON files.
 */
import { readFileSync, writeFileSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { type EosData, type TermGroup, type Ancillary } from '../shared/utils/properties/helmholtz'
import { pureResidual } from '../shared/utils/properties/eos'
import { criticalPoint } from '../shared/utils/properties/saturation'

const SRC = process.argv[2] ?? '/work/shared/reference/eos'
const OUT = new URL('../shared/utils/properties/data/', import.meta.url).pathname

/** Human citation per BibTeX key found in EOS.BibTeX_EOS. */
const CITATIONS: Record<string, string> = {
  'Smukala-JPCRD-2000': 'Smukala, Span & Wagner 2000, J. Phys. Chem. Ref. Data (ethylene reference EOS)',
  'Buecker-JPCRD-2006': 'Bücker & Wagner 2006, J. Phys. Chem. Ref. Data (ethane reference EOS)',
  'Lemmon-JCED-2009': 'Lemmon, McLinden & Wagner 2009, J. Chem. Eng. Data (propane reference EOS)',
  'Buecker-JPCRD-2006B': 'Bücker & Wagner 2006, J. Phys. Chem. Ref. Data (n-butane and isobutane reference EOS)',
  'Lemmon-PROPYLENE-2013': 'Lemmon et al. propylene reference EOS (CoolProp key Lemmon-PROPYLENE-2013)',
  'Setzmann-JPCRD-1991': 'Setzmann & Wagner 1991, J. Phys. Chem. Ref. Data (methane reference EOS)',
  'Platzer-BOOK-1990': 'Platzer, Polt & Maurer 1990, Thermophysical Properties of Refrigerants (R14 EOS)',
  'Penoncello-JPCRD-2003': 'Penoncello, Shan & Jacobsen 2003, J. Phys. Chem. Ref. Data (R23 reference EOS)',
  'Lemmon-JCED-2006': 'Lemmon & Span 2006, J. Chem. Eng. Data (short EOS, R116)',
  'Lemmon-IJT-2003': 'Lemmon 2003, Int. J. Thermophys. (pseudo-pure EOS for R404A, R407C, R410A, R507A)',
  'TillnerRoth-JPCRD-1994': 'Tillner-Roth & Baehr 1994, J. Phys. Chem. Ref. Data (R134a reference EOS)',
  'Kamei-IJT-1995': 'Kamei, Beyerlein & Jacobsen 1995, Int. J. Thermophys. (R22 EOS)',
  'Span-JPCRD-1996': 'Span & Wagner 1996, J. Phys. Chem. Ref. Data (CO2 reference EOS)',
  'Gao-JPCRD-2020': 'Gao et al. 2020, J. Phys. Chem. Ref. Data (ammonia reference EOS)',
  'Marx-BOOK-1992': 'Marx, Pruß & Wagner 1992, VDI Fortschritt-Berichte 19/57 (R12 reference EOS)',
}
/** Platzer, Polt & Maurer's book gives equations for several refrigerants under one key: name the fluid. */
const CITATION_BY_FLUID: Record<string, string> = {
  R13: 'Platzer, Polt & Maurer 1990, Thermophysical Properties of Refrigerants (R13 EOS)',
}

type Json = Record<string, unknown>
const nums = (o: Json, k: string): number[] => o[k] as number[]

function convertTerm(t: Json): TermGroup {
  switch (t.type) {
    case 'ResidualHelmholtzPower': return { type: 'power', n: nums(t, 'n'), d: nums(t, 'd'), t: nums(t, 't'), l: nums(t, 'l') }
    case 'ResidualHelmholtzExponential': return { type: 'exponential', n: nums(t, 'n'), d: nums(t, 'd'), t: nums(t, 't'), g: nums(t, 'g'), l: nums(t, 'l') }
    case 'ResidualHelmholtzGaussian': return { type: 'gaussian', n: nums(t, 'n'), d: nums(t, 'd'), t: nums(t, 't'), eta: nums(t, 'eta'), epsilon: nums(t, 'epsilon'), beta: nums(t, 'beta'), gamma: nums(t, 'gamma') }
    case 'ResidualHelmholtzGaoB': return { type: 'gaoB', n: nums(t, 'n'), d: nums(t, 'd'), t: nums(t, 't'), eta: nums(t, 'eta'), epsilon: nums(t, 'epsilon'), beta: nums(t, 'beta'), gamma: nums(t, 'gamma'), b: nums(t, 'b') }
    case 'ResidualHelmholtzNonAnalytic': return { type: 'nonAnalytic', n: nums(t, 'n'), a: nums(t, 'a'), b: nums(t, 'b'), beta: nums(t, 'beta'), A: nums(t, 'A'), B: nums(t, 'B'), C: nums(t, 'C'), D: nums(t, 'D') }
    default: throw new Error(`unsupported term type ${String(t.type)}`)
  }
}

function convertAnc(a: Json): Ancillary {
  const type = a.type as string
  const form = type === 'pL' || type === 'pV' ? 'p' : type === 'rhoLnoexp' ? 'rhoLnoexp' : type === 'rhoV' ? 'rhoV' : null
  if (!form) throw new Error(`unsupported ancillary ${type}`)
  return { form, Tr: a.T_r as number, reducing: a.reducing_value as number, n: nums(a, 'n'), t: nums(a, 't'), usingTauR: a.using_tau_r as boolean, Tmin: a.Tmin as number, Tmax: a.Tmax as number }
}

const names: string[] = []
for (const file of readdirSync(SRC).filter((f) => f.endsWith('.json')).sort()) {
  const j = JSON.parse(readFileSync(join(SRC, file), 'utf8')) as Json
  const eos = j.EOS as Json
  const red = (eos.STATES as Json).reducing as Json
  const anc = j.ANCILLARIES as Record<string, Json>
  const bib = eos.BibTeX_EOS as string
  const designation = j.designation as string
  const pseudoPure = eos.pseudo_pure as boolean
  const data: EosData = {
    designation,
    source: `${CITATION_BY_FLUID[designation] ?? CITATIONS[bib] ?? bib}; coefficients as distributed in CoolProp 8.0.0 (MIT licence)`,
    R: eos.gas_constant as number,
    M: eos.molar_mass as number,
    Tr: red.T as number,
    rhor: red.rhomolar as number,
    Ttriple: eos.Ttriple as number,
    Tmax: eos.T_max as number,
    pmax: eos.p_max as number,
    crit: { T: red.T as number, p: red.p as number, rho: red.rhomolar as number },
    terms: (eos.alphar as Json[]).map(convertTerm),
    anc: {
      ...(anc.pS ? { pS: convertAnc(anc.pS) } : {}),
      ...(anc.pL ? { pL: convertAnc(anc.pL) } : {}),
      ...(anc.pV ? { pV: convertAnc(anc.pV) } : {}),
      rhoL: convertAnc(anc.rhoL!),
      rhoV: convertAnc(anc.rhoV!),
    },
  }
  // A pseudo-pure fluid's "critical point" is the model's pseudo-critical point = its reducing state.
  if (!pseudoPure) data.crit = criticalPoint(pureResidual(data), data.Tr, data.rhor)
  const ident = designation
  const body = `// ${data.source}.\n// Generated by scripts/extract-eos.ts from CoolProp 8.0.0's fluid file; do not edit by hand.\n`
    + `import type { EosData } from '../helmholtz'\n\nexport const ${ident}: EosData = ${JSON.stringify(data)}\n`
  writeFileSync(join(OUT, `${designation}.ts`), body)
  names.push(ident)
  console.log(designation, bib, 'crit', data.crit, 'reducing', data.Tr, red.p)
}
writeFileSync(join(OUT, 'index.ts'),
  `// Generated by scripts/extract-eos.ts. Reference EOS coefficients per fluid (sources cited in each file).\n`
  + names.map((n) => `import { ${n} } from './${n}'`).join('\n')
  + `\nimport type { EosData } from '../helmholtz'\n\nexport const EOS_DATA: Record<string, EosData> = { ${names.join(', ')} }\n`)
