/**
 * Receptors (optional top-level scenario field `receptors`): neighbours the drawdown may harm — a
 * building, a wall, a service, another well, a pond — as a point or a polyline in site
 * coordinates, with the compressible layer beneath them and the limits they can take.
 * Additive to scenario format v1 (design.md §3): absent means no receptors; nothing else changes.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { FieldIssue } from './error-table';
import { COMPRESSIBILITY_RANGE_M2_KN, Coordinate, LEVEL_LIMIT_M, OEDOMETER_MODULUS_RANGE_KPA } from './physical-ranges';

/**
 * Default allowable angular distortion β = 1/500: Bjerrum (1963) "Allowable settlement of
 * structures", his "safe limit for buildings where cracking is not permissible", the limit also
 * recommended for design by Skempton & MacDonald (1956) and discussed by Burland & Wroth (1974)
 * (from memory; local codes and the owner of the structure may set another).
 */
export const DEFAULT_ALLOWABLE_ANGULAR_DISTORTION = 1 / 500;

export const ReceptorKindSchema = Type.Union(
  [Type.Literal('building'), Type.Literal('wall'), Type.Literal('service'), Type.Literal('well'), Type.Literal('pond'), Type.Literal('other')],
  { description: 'What the receptor is.' },
);
export type ReceptorKind = Static<typeof ReceptorKindSchema>;

const Position = Type.Tuple([Coordinate(), Coordinate()], { description: 'Plan position [x, y] in site metres.' });

/** Geometry in the words of GeoJSON (RFC 7946), in site coordinates (not longitude/latitude). */
export const ReceptorGeometrySchema = Type.Union([
  Type.Object({ type: Type.Literal('Point'), coordinates: Position }, { additionalProperties: false }),
  Type.Object(
    { type: Type.Literal('LineString'), coordinates: Type.Array(Position, { minItems: 2, maxItems: 1000, description: 'Points along the receptor (supports, corners, joints), in order.' }) },
    { additionalProperties: false },
  ),
]);
export type ReceptorGeometry = Static<typeof ReceptorGeometrySchema>;

export const CompressibleLayerSchema = Type.Object(
  {
    thickness_m: Type.Number({ exclusiveMinimum: 0, maximum: LEVEL_LIMIT_M, description: 'Thickness H of the compressible layer under the receptor, m.' }),
    mv_m2_kN: Type.Optional(
      Type.Number({ minimum: COMPRESSIBILITY_RANGE_M2_KN[0], maximum: COMPRESSIBILITY_RANGE_M2_KN[1], description: 'Coefficient of volume compressibility m_v, m²/kN (give this or oedometerModulus_kPa).' }),
    ),
    oedometerModulus_kPa: Type.Optional(
      Type.Number({ minimum: OEDOMETER_MODULUS_RANGE_KPA[0], maximum: OEDOMETER_MODULUS_RANGE_KPA[1], description: 'Oedometer modulus E_oed = 1/m_v, kPa (give this or mv_m2_kN).' }),
    ),
    headChange: Type.Optional(
      Type.Union([Type.Literal('uniform'), Type.Literal('linear')], {
        description:
          "How the drawdown acts over the layer: 'uniform' (default) — the full drawdown through its thickness (a compressible layer within the pumped aquifer); 'linear' — full at the layer's base, none at its top (an aquitard over a pumped aquifer with its upper water table held), so the mean drawdown is half.",
      }),
    ),
  },
  { additionalProperties: false },
);
export type CompressibleLayer = Static<typeof CompressibleLayerSchema>;

export const ReceptorSchema = Type.Object(
  {
    id: Type.String({ minLength: 1, maxLength: 64 }),
    kind: ReceptorKindSchema,
    label: Type.Optional(Type.String({ maxLength: 200 })),
    geometry: ReceptorGeometrySchema,
    compressibleLayer: Type.Optional(CompressibleLayerSchema),
    allowableSettlement_m: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 10, description: 'Settlement the receptor can take, m.' })),
    allowableAngularDistortion: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: 1, description: 'Angular distortion β = Δs/L it can take between neighbouring points (−). Default 1/500 (Bjerrum 1963).' }),
    ),
    maxDrawdown_m: Type.Optional(
      Type.Number({ minimum: 0, maximum: LEVEL_LIMIT_M, description: 'Most drawdown allowed anywhere on the receptor, m: the optimal design keeps within it.' }),
    ),
    lowAlertOffset_m: Type.Optional(
      Type.Number({ minimum: 0, maximum: 20, description: 'Monitoring: alert when a reading stands this far below the expected level, m. Default 0.3.' }),
    ),
  },
  { additionalProperties: false },
);
export type Receptor = Static<typeof ReceptorSchema>;

export const ReceptorsSchema = Type.Array(ReceptorSchema, { maxItems: 500 });

/** The scenario's receptors (none when the field is absent). */
export function getReceptors(scenario: object): Receptor[] {
  return (scenario as { receptors?: Receptor[] }).receptors ?? [];
}

/** m_v of a layer, m²/kN (E_oed = 1/m_v when the modulus is given). */
export function layerCompressibility_m2_kN(layer: CompressibleLayer): number {
  return layer.mv_m2_kN ?? 1 / layer.oedometerModulus_kPa!;
}

/** Meaning checks of the receptors (structure is the scenario schema's): ids, one compressibility, distinct points. */
export function receptorIssues(receptors: readonly Receptor[]): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const ids = new Set<string>();
  receptors.forEach((r, i) => {
    const at = `/receptors/${i}`;
    if (ids.has(r.id)) issues.push({ path: `${at}/id`, message: `duplicate receptor id "${r.id}"` });
    ids.add(r.id);
    const layer = r.compressibleLayer;
    if (layer && (layer.mv_m2_kN === undefined) === (layer.oedometerModulus_kPa === undefined))
      issues.push({ path: `${at}/compressibleLayer`, message: 'give exactly one of mv_m2_kN (coefficient of volume compressibility) or oedometerModulus_kPa (E_oed = 1/m_v)' });
    if (r.allowableSettlement_m !== undefined && !layer)
      issues.push({ path: `${at}/compressibleLayer`, message: 'is required with allowableSettlement_m: settlement needs the layer’s thickness and compressibility' });
    if (r.geometry.type === 'LineString') {
      const c = r.geometry.coordinates;
      for (let k = 1; k < c.length; k++)
        if (c[k]![0] === c[k - 1]![0] && c[k]![1] === c[k - 1]![1])
          issues.push({ path: `${at}/geometry/coordinates/${k}`, message: 'repeats the point before it: neighbouring points must differ (the angular distortion divides by their distance)' });
    }
  });
  return issues;
}
