/**
 * Section document (`format: "drydig.section"`, version 1): a vertical section through an
 * excavation for steady seepage — plane flow per metre run, or axisymmetric about x = 0 (a shaft
 * or caisson, x = radius). Contract: `../shared/design.md` §8; fields added here are optional.
 * Levels are elevations (m above the site datum); SI inside; every field name carries its unit.
 */
import { Type, type Static } from '@sinclair/typebox';

const Level = (description: string) => Type.Number({ minimum: -20_000, maximum: 20_000, description });
const Conductivity = (description: string) => Type.Number({ minimum: 1e-14, maximum: 1, description });

export const SectionLayerSchema = Type.Object(
  {
    id: Type.Optional(Type.String({ maxLength: 64 })),
    top_m: Level('Layer top, m.'),
    bottom_m: Level('Layer bottom, m (the lowest layer’s bottom is the impermeable base).'),
    kh_m_s: Conductivity('Horizontal hydraulic conductivity, m/s.'),
    kv_m_s: Conductivity('Vertical hydraulic conductivity, m/s.'),
    kind: Type.Optional(Type.Union([Type.Literal('plug'), Type.Literal('granular')], { description: 'plug: a low-permeability layer whose weight resists uplift; default granular.' })),
    unitWeightSat_kN_m3: Type.Optional(Type.Number({ minimum: 12, maximum: 26, description: 'Saturated unit weight, kN/m³. Default 20 (common practice, assumed).' })),
  },
  { additionalProperties: false },
);
export type SectionLayer = Static<typeof SectionLayerSchema>;

export const SectionSurfaceSchema = Type.Object(
  {
    x0_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Segment start, m.' }),
    x1_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Segment end, m.' }),
    level_m: Level('Ground (or floor) level on this segment, m.'),
    head_m: Type.Union([Level('Fixed water level on the segment (ponded, pumped or drained), m.'), Type.Null()], {
      description: 'Fixed head on the segment, m; null = no flow across it.',
    }),
  },
  { additionalProperties: false },
);
export type SectionSurface = Static<typeof SectionSurfaceSchema>;

export const SectionWallSchema = Type.Object(
  {
    x_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Wall position, m (zero thickness, impermeable).' }),
    top_m: Level('Wall top, m.'),
    toe_m: Level('Wall toe, m.'),
  },
  { additionalProperties: false },
);
export type SectionWall = Static<typeof SectionWallSchema>;

export const SectionDrainSchema = Type.Object(
  {
    x_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Drain position, m.' }),
    level_m: Level('Drain level, m.'),
    head_m: Level('Head held in the drain, m.'),
    radius_m: Type.Optional(Type.Number({ minimum: 0.01, maximum: 1, description: 'Drain radius, m: the mesh is refined to it. Default 0.05.' })),
  },
  { additionalProperties: false },
);
export type SectionDrain = Static<typeof SectionDrainSchema>;

export const SectionWellSchema = Type.Object(
  {
    x_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Well (plane: a row of wells, as a line) position, m.' }),
    screenTop_m: Level('Screen top, m.'),
    screenBottom_m: Level('Screen bottom, m.'),
    head_m: Type.Optional(Level('Fixed head in the well, m (relief well or pumped to a level).')),
    rate_m3_s_per_m: Type.Optional(Type.Number({ minimum: -1, maximum: 1, description: 'Plane: abstraction per metre of section, m³/s/m (positive out).' })),
    rate_m3_s: Type.Optional(Type.Number({ minimum: -10, maximum: 10, description: 'Axisymmetric: abstraction of the ring (or central well), m³/s (positive out).' })),
    spacing_m: Type.Optional(Type.Number({ minimum: 0.5, maximum: 500, description: 'Spacing of the wells in the row, m (for the report; the plane model treats the row as a slot).' })),
  },
  { additionalProperties: false },
);
export type SectionWell = Static<typeof SectionWellSchema>;

export const SectionSlabSchema = Type.Object(
  {
    x0_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Slab start, m.' }),
    x1_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Slab end, m.' }),
    thickness_m: Type.Number({ minimum: 0.05, maximum: 10, description: 'Slab thickness, m.' }),
    unitWeight_kN_m3: Type.Optional(Type.Number({ minimum: 10, maximum: 30, description: 'Slab unit weight, kN/m³. Default 24 (reinforced concrete, common practice).' })),
  },
  { additionalProperties: false, description: 'An impermeable slab on the floor: no flow through it; the results give the uplift under it.' },
);
export type SectionSlab = Static<typeof SectionSlabSchema>;

export const SectionMeshSchema = Type.Object(
  {
    maxSize_m: Type.Optional(Type.Number({ minimum: 0.005, maximum: 1000, description: 'Largest cell side, m. Default: the smaller of the section’s width and depth / 30.' })),
    minSize_m: Type.Optional(Type.Number({ minimum: 0.001, maximum: 100, description: 'Cell side at wall toes, the floor and wells, m. Default maxSize / 25.' })),
    growth: Type.Optional(Type.Number({ minimum: 1.02, maximum: 2, description: 'Largest ratio of neighbouring cell sides. Default 1.15.' })),
    subdivide: Type.Optional(Type.Integer({ minimum: 1, maximum: 16, description: 'Split every cell into this many per side (mesh convergence studies). Default 1.' })),
    tolerance: Type.Optional(Type.Number({ minimum: 1e-15, maximum: 1e-4, description: 'Relative residual at which the conjugate-gradient solve stops. Default 1e-12.' })),
  },
  { additionalProperties: false },
);
export type SectionMeshOptions = Static<typeof SectionMeshSchema>;

export const SectionDocumentSchema = Type.Object(
  {
    format: Type.Literal('drydig.section'),
    version: Type.Literal(1),
    name: Type.Optional(Type.String({ maxLength: 200 })),
    geometry: Type.Union([Type.Literal('plane'), Type.Literal('axisymmetric')], { description: 'plane: flow per metre run; axisymmetric: x is the radius from the axis.' }),
    extent: Type.Object(
      { x0_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Left edge, m (axisymmetric: ≥ 0).' }), x1_m: Type.Number({ minimum: -1e6, maximum: 1e6, description: 'Right edge, m.' }) },
      { additionalProperties: false },
    ),
    layers: Type.Array(SectionLayerSchema, { minItems: 1, maxItems: 50 }),
    surface: Type.Array(SectionSurfaceSchema, { minItems: 1, maxItems: 100 }),
    walls: Type.Optional(Type.Array(SectionWallSchema, { maxItems: 20 })),
    drains: Type.Optional(Type.Array(SectionDrainSchema, { maxItems: 200 })),
    wells: Type.Optional(Type.Array(SectionWellSchema, { maxItems: 200 })),
    slab: Type.Optional(SectionSlabSchema),
    floor: Type.Optional(
      Type.Object(
        { x0_m: Type.Number({ minimum: -1e6, maximum: 1e6 }), x1_m: Type.Number({ minimum: -1e6, maximum: 1e6 }) },
        { additionalProperties: false, description: 'The excavation floor span, m. Default: the surface segments at the lowest level.' },
      ),
    ),
    requiredFS: Type.Optional(Type.Number({ minimum: 1, maximum: 5, description: 'Factor required on the critical gradient and on heave. Default 1.5 (a global factor; national annexes differ).' })),
    mesh: Type.Optional(SectionMeshSchema),
  },
  { additionalProperties: false },
);
export type SectionDocument = Static<typeof SectionDocumentSchema>;
