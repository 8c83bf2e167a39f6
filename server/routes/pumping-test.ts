/**
 * `POST /api/v1/pumping-test`: aquifer parameters from a pumping test's readings — the readings
 * as CSV text (the file format of `drydig pumping-test`) or as rows, the rate, distance and stop
 * time — answered with the analysis of design.md §8 (`{ fits: [...] }`, the same as the CLI).
 * Bad rows are a 400 naming each line. The analysis is small (≤ 20 000 readings, a few hundred
 * well-function evaluations per fit step) and bounded by the row limit; it runs on the compute pool.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { FastifyPluginAsync } from 'fastify';
import { DrydigError } from '../../shared/schema';
import { PumpingTestResultSchema, TestMethodSchema, parseReadingsCsv, type TestReading } from '../../shared/testing';
import { computeRateLimit, type SecurityOptions } from '../security';
import { ErrorResponseSchema } from '../request-schemas';
import { currentCompute } from '../compute';

/** Most readings one request may carry. */
export const MAX_API_READINGS = 20_000;

const ReadingRowSchema = Type.Object(
  {
    time_s: Type.Number({ exclusiveMinimum: 0, maximum: 1e9, description: 'Elapsed since pumping started, s.' }),
    drawdown_m: Type.Number({ minimum: -1000, maximum: 1000, description: 'Drawdown, m (positive downward).' }),
    distance_m: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 1e5, description: 'Distance from the pumped well, m (default: distance_m of the body).' })),
    well: Type.Optional(Type.String({ minLength: 1, maxLength: 64 })),
    phase: Type.Optional(Type.Union([Type.Literal('pumping'), Type.Literal('recovery')])),
    rate_m3_s: Type.Optional(Type.Number({ minimum: -10, maximum: 10, description: 'Rate at that time, m³/s (step tests).' })),
  },
  { additionalProperties: false },
);

export const PumpingTestRequestSchema = Type.Object(
  {
    csv: Type.Optional(Type.String({ maxLength: 4_000_000, description: 'Readings as CSV text (see the README: columns time_s|time_min|…, drawdown_m|…, distance_m, well, phase, rate_…).' })),
    readings: Type.Optional(Type.Array(ReadingRowSchema, { maxItems: MAX_API_READINGS })),
    rate_m3_s: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 10, description: 'Constant pumping rate, m³/s.' })),
    distance_m: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 1e5, description: 'Observation distance for rows without one, m.' })),
    staticLevel_m: Type.Optional(Type.Number({ minimum: -20_000, maximum: 20_000, description: 'Static level, m, when the CSV gives water levels.' })),
    stop_s: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 1e9, description: 'Pump stop time, s.' })),
    methods: Type.Optional(Type.Array(TestMethodSchema, { minItems: 1, maxItems: 5 })),
    perWell: Type.Optional(Type.Boolean()),
    uMax: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 1, description: 'Cooper–Jacob / recovery limit of u (default 0.05).' })),
    timeUnit: Type.Optional(Type.Union([Type.Literal('s'), Type.Literal('min'), Type.Literal('h'), Type.Literal('d')])),
    lengthUnit: Type.Optional(Type.Union([Type.Literal('m'), Type.Literal('ft')])),
  },
  { additionalProperties: false, description: 'Readings (csv or readings), the rate, and options.' },
);
export type PumpingTestRequest = Static<typeof PumpingTestRequestSchema>;

function readingsOf(body: PumpingTestRequest): TestReading[] {
  if ((body.csv === undefined) === (body.readings === undefined))
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/csv: give the readings either as csv text or as readings rows (one of the two)', [{ path: '/csv', message: 'give csv or readings, not both or neither' }]);
  if (body.csv !== undefined) {
    const rows = parseReadingsCsv(body.csv, {
      sourceName: '/csv',
      ...(body.rate_m3_s !== undefined ? { rate_m3_s: body.rate_m3_s } : {}),
      ...(body.distance_m !== undefined ? { distance_m: body.distance_m } : {}),
      ...(body.staticLevel_m !== undefined ? { staticLevel_m: body.staticLevel_m } : {}),
      ...(body.stop_s !== undefined ? { stop_s: body.stop_s } : {}),
      ...(body.timeUnit ? { timeUnit: body.timeUnit } : {}),
      ...(body.lengthUnit ? { lengthUnit: body.lengthUnit } : {}),
    });
    if (rows.length > MAX_API_READINGS) throw new DrydigError('DRYDIG_ERR_INVALID_READINGS', `/csv: ${rows.length} readings; at most ${MAX_API_READINGS} per request`);
    return rows;
  }
  return body.readings!.map((r, i) => {
    const distance_m = r.distance_m ?? body.distance_m;
    const rate_m3_s = r.rate_m3_s ?? body.rate_m3_s;
    const path = `/readings/${i}`;
    if (distance_m === undefined) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}/distance_m: give a distance for the row or distance_m for the body`, [{ path: `${path}/distance_m`, message: 'is required' }]);
    if (rate_m3_s === undefined) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/rate_m3_s: give the pumping rate (or a rate for each row)`, [{ path: '/rate_m3_s', message: 'is required' }]);
    const phase = r.phase ?? (body.stop_s !== undefined && r.time_s > body.stop_s ? 'recovery' : 'pumping');
    return { time_s: r.time_s, drawdown_m: r.drawdown_m, distance_m, rate_m3_s, well: r.well ?? 'obs', phase, line: i };
  });
}

export const pumpingTestRoutes: FastifyPluginAsync<{ security?: SecurityOptions }> = async (app, options) => {
  app.post<{ Body: PumpingTestRequest }>(
    '/pumping-test',
    {
      config: computeRateLimit(options.security),
      schema: {
        summary: 'Aquifer parameters from pumping-test readings',
        description:
          'Fits the published methods that apply: Theis curve (log T, log S by Levenberg–Marquardt), Cooper–Jacob straight line (automatic small-u window), Theis recovery, '
          + 'Hantush–Jacob leaky fit, step-drawdown analysis (B, C, efficiency). Each fit carries an approximate 95 % confidence interval, its RMSE, the validity of the method on '
          + 'the data, departures from the model seen in the residuals, and the fitted curve and residuals for plotting.',
        tags: ['pumping test'],
        body: PumpingTestRequestSchema,
        response: { 200: PumpingTestResultSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
    },
    async (request) => {
      const body = request.body;
      const readings = readingsOf(body);
      return currentCompute().run('pumpingTest', {
        readings,
        ...(body.methods ? { methods: body.methods } : {}),
        stop_s: body.stop_s ?? null,
        perWell: body.perWell === true,
        ...(body.uMax !== undefined ? { uMax: body.uMax } : {}),
        path: '',
      });
    },
  );
};
