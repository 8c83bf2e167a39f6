/**
 * The optional top-level `view` section of a scenario: how the plan-map client shows it (display
 * units, contour choice, site-plan underlay, web-map tile URL, section lines). Nothing here feeds
 * the engine. The scenario schema allows extra top-level fields; this schema lets the client (and
 * the server, if it wishes) check a saved `view` and name a bad field instead of failing on it.
 */
import { Type, type Static } from '@sinclair/typebox';

const XY = Type.Tuple([Type.Number({ minimum: -1e8, maximum: 1e8 }), Type.Number({ minimum: -1e8, maximum: 1e8 })]);

export const UnderlayRefSchema = Type.Object(
  { pixel: XY, site: XY },
  { additionalProperties: false, description: 'A reference point: image pixel (x right, y down) and its site position, m.' },
);

export const UnderlaySchema = Type.Object(
  {
    imageDataUrl: Type.String({ pattern: '^data:image/(png|jpeg|webp|gif);base64,', maxLength: 12_000_000, description: 'The image as a data: URL.' }),
    width_px: Type.Number({ exclusiveMinimum: 0, maximum: 100_000 }),
    height_px: Type.Number({ exclusiveMinimum: 0, maximum: 100_000 }),
    refs: Type.Tuple([UnderlayRefSchema, UnderlayRefSchema]),
    opacity: Type.Optional(Type.Number({ minimum: 0, maximum: 1 })),
  },
  { additionalProperties: false, description: 'Site-plan image placed by two reference points.' },
);

export const ViewSchema = Type.Object(
  {
    units: Type.Optional(Type.Object({
      system: Type.Optional(Type.Union([Type.Literal('si'), Type.Literal('us')])),
      rate: Type.Optional(Type.String({ maxLength: 16 })),
      velocity: Type.Optional(Type.String({ maxLength: 16 })),
    }, { additionalProperties: false })),
    contour: Type.Optional(Type.Object({
      quantity: Type.Optional(Type.Union([Type.Literal('drawdown'), Type.Literal('level')])),
      step_m: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 1000, description: 'Contour interval, m.' })),
    }, { additionalProperties: false })),
    underlay: Type.Optional(UnderlaySchema),
    tileUrl: Type.Optional(Type.String({ pattern: '^https://', maxLength: 500, description: 'Web-map tile URL template with {z}/{x}/{y}.' })),
    sections: Type.Optional(Type.Array(Type.Object({ from: XY, to: XY }, { additionalProperties: false }), { maxItems: 20 })),
  },
  { additionalProperties: true, description: 'Plan-map view settings (client only).' },
);
export type ViewSettingsV1 = Static<typeof ViewSchema>;
