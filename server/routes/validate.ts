/**
 * `POST /api/v1/validate`: checks a scenario without computing anything. Errors (the scenario
 * cannot be run) answer 400 naming the field, as on every route; a runnable scenario answers
 * `{ ok: true, warnings }`, the things accepted but probably not meant (`findScenarioWarnings`).
 */
import { Type, type Static } from '@sinclair/typebox';
import type { FastifyPluginAsync } from 'fastify';
import { findScenarioWarnings, parseScenario, ScenarioSchema, ScenarioWarningSchema } from '../../shared/schema';
import { ErrorResponseSchema } from '../request-schemas';

export const ValidateRequestSchema = Type.Object({ scenario: ScenarioSchema }, { additionalProperties: false });
export const ValidateResponseSchema = Type.Object(
  { ok: Type.Literal(true), warnings: Type.Array(ScenarioWarningSchema, { description: 'Accepted, but probably not meant; each names its field.' }) },
  { additionalProperties: false },
);
export type ValidateResponse = Static<typeof ValidateResponseSchema>;

export const validateRoutes: FastifyPluginAsync = async (app) => {
  app.post<{ Body: Static<typeof ValidateRequestSchema> }>(
    '/validate',
    {
      schema: {
        summary: 'Check a scenario: errors (400) or warnings',
        description: 'Validates the scenario with the shared validator; a runnable scenario comes back with warnings by JSON pointer (two wells at one spot, a screen above the water table, water above ground, an implausible well radius).',
        tags: ['evaluate'],
        body: ValidateRequestSchema,
        response: { 200: ValidateResponseSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
      preValidation: async (request) => {
        const raw = request.body as { scenario?: unknown } | null | undefined;
        if (raw && typeof raw === 'object' && !Array.isArray(raw) && 'scenario' in raw) parseScenario(raw.scenario, '/scenario');
      },
    },
    async (request): Promise<ValidateResponse> => ({ ok: true, warnings: findScenarioWarnings(request.body.scenario, '/scenario') }),
  );
};
