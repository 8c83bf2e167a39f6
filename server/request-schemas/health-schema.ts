/** Response schema of `GET /api/v1/health`. */
import { Type, type Static } from '@sinclair/typebox';
import { MODEL_METHODS, PointFlagSchema } from './evaluate-schemas';

export const HealthResponseSchema = Type.Object(
  {
    status: Type.Literal('ok'),
    version: Type.String({ description: 'drydig version (package.json).' }),
    engine: Type.Object(
      {
        scenarioFormat: Type.Literal('drydig.scenario'),
        scenarioVersion: Type.Literal(1),
        methods: Type.Array(Type.Union(MODEL_METHODS.map((m) => Type.Literal(m))), { description: 'Methods the engine applies.' }),
        flags: Type.Array(PointFlagSchema, { description: 'Validity flags results may carry.' }),
      },
      { additionalProperties: false },
    ),
    limits: Type.Object(
      {
        bodyLimit_bytes: Type.Integer({ description: 'Largest accepted request body, bytes.' }),
        maxPoints: Type.Integer({ description: 'Largest points × times per evaluate request.' }),
        maxGridNodes: Type.Integer({ description: 'Largest grid nodes × times per evaluate request.' }),
      },
      { additionalProperties: false },
    ),
  },
  { additionalProperties: false },
);
export type HealthResponse = Static<typeof HealthResponseSchema>;
