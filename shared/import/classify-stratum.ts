/**
 * A first guess at how a logged stratum behaves under an excavation floor, from its description
 * (BS 5930 / EN ISO 14688 style, principal soil type in capitals: "Firm brown silty CLAY"), with
 * typical unit weights. Only a suggestion: the designer confirms each layer's kind and weights
 * before the floor checks use them. Unit weights are common practice (typical values as given in
 * soil mechanics texts, from memory), not site data.
 */
import type { GroundLayerSuggestion } from './ground-from-boreholes';

interface Rule {
  pattern: RegExp;
  kind: 'plug' | 'granular';
  unitWeightSat_kN_m3: number;
  unitWeight_kN_m3: number;
  label: string;
}

// Order matters: the principal soil (capitals) is matched before secondary words.
const RULES: Rule[] = [
  { pattern: /\bPEAT\b/, kind: 'plug', unitWeightSat_kN_m3: 11, unitWeight_kN_m3: 10.5, label: 'peat' },
  { pattern: /\bCLAY\b/, kind: 'plug', unitWeightSat_kN_m3: 19.5, unitWeight_kN_m3: 18.5, label: 'clay' },
  { pattern: /\bSILT\b/, kind: 'plug', unitWeightSat_kN_m3: 19, unitWeight_kN_m3: 18, label: 'silt' },
  { pattern: /\b(MUDSTONE|SILTSTONE|SHALE)\b/, kind: 'plug', unitWeightSat_kN_m3: 22, unitWeight_kN_m3: 21.5, label: 'mudrock' },
  { pattern: /\bGRAVEL\b/, kind: 'granular', unitWeightSat_kN_m3: 21, unitWeight_kN_m3: 19, label: 'gravel' },
  { pattern: /\bSAND\b/, kind: 'granular', unitWeightSat_kN_m3: 20, unitWeight_kN_m3: 18, label: 'sand' },
  { pattern: /\b(SANDSTONE|LIMESTONE|CHALK)\b/, kind: 'granular', unitWeightSat_kN_m3: 21, unitWeight_kN_m3: 20, label: 'fissured rock' },
  { pattern: /\b(MADE GROUND|TOPSOIL|FILL)\b/i, kind: 'granular', unitWeightSat_kN_m3: 19, unitWeight_kN_m3: 17, label: 'made ground' },
];

/** The suggested kind and weights of a stratum, and why. */
export function classifyStratum(description: string): Pick<GroundLayerSuggestion, 'kind' | 'unitWeightSat_kN_m3' | 'unitWeight_kN_m3' | 'basis'> & { soil: string } {
  for (const r of RULES)
    if (r.pattern.test(description))
      return { soil: r.label, kind: r.kind, unitWeightSat_kN_m3: r.unitWeightSat_kN_m3, unitWeight_kN_m3: r.unitWeight_kN_m3, basis: `read as ${r.label} from the description; typical weights (common practice) — confirm` };
  const lower = description.toLowerCase();
  if (/clay|silt/.test(lower)) return { soil: 'clay or silt', kind: 'plug', unitWeightSat_kN_m3: 19.5, unitWeight_kN_m3: 18.5, basis: 'description mentions clay or silt; confirm' };
  return { soil: 'unknown', kind: 'granular', unitWeightSat_kN_m3: 20, unitWeight_kN_m3: 18, basis: 'no principal soil recognised; assumed granular — confirm' };
}
