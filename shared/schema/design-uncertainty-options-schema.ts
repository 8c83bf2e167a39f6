/**
 * Design options for designs that survive the unknowns (spread into `DesignOptionsSchema`): the
 * sensitivity table (K and S scaled by factors), the Monte Carlo analysis (lognormal K, optionally
 * S), and the robust design options (any one well out of service; K within a factor).
 */
import { Type } from '@sinclair/typebox';

/** Most realisations one Monte Carlo run may ask for. */
export const MAX_MONTE_CARLO_RUNS = 20_000;
/** Largest geometric standard deviation accepted for K or S (a factor of 10 is already wider than most site data). */
export const MAX_SPREAD_FACTOR = 10;
/** Smallest and largest scaling factor in the sensitivity table and the robust K range. */
export const MIN_SCALE_FACTOR = 0.01;
export const MAX_SCALE_FACTOR = 100;

const Factor = Type.Number({ minimum: MIN_SCALE_FACTOR, maximum: MAX_SCALE_FACTOR });

export const SensitivityOptionsSchema = Type.Object(
  {
    factors: Type.Optional(
      Type.Array(Factor, { minItems: 1, maxItems: 12, description: 'Factors K and S are scaled by, each on its own (−). Default [1/3, 1/2, 1, 2, 3].' }),
    ),
    parameters: Type.Optional(
      Type.Array(Type.Union([Type.Literal('conductivity'), Type.Literal('storage')]), {
        minItems: 1,
        maxItems: 2,
        uniqueItems: true,
        description: 'Which to scale: conductivity (K) and storage (S, or Sy when unconfined). Default both (storage only for transient designs).',
      }),
    ),
  },
  { additionalProperties: false, description: 'Sensitivity table: the chosen design re-evaluated at its rates and re-solved with K or S scaled.' },
);

export const MonteCarloOptionsSchema = Type.Object(
  {
    runs: Type.Integer({ minimum: 1, maximum: MAX_MONTE_CARLO_RUNS, description: 'Realisations (−). Typical 1000.' }),
    seed: Type.Optional(Type.Integer({ minimum: 0, maximum: 4_294_967_295, description: 'Seed of the random numbers; the same seed gives the same answer. Default 1.' })),
    kSpread: Type.Optional(
      Type.Number({ minimum: 1, maximum: MAX_SPREAD_FACTOR, description: 'Geometric standard deviation F of K (lognormal, median = the scenario’s K: K/F … K·F holds 68 %). Default: from the pumping test’s K interval when the scenario has one, else 2.' }),
    ),
    sSpread: Type.Optional(
      Type.Number({ minimum: 1, maximum: MAX_SPREAD_FACTOR, description: 'Geometric standard deviation of S (or Sy), sampled independently of K. Default 1 (S held).' }),
    ),
    bins: Type.Optional(Type.Integer({ minimum: 4, maximum: 60, description: 'Histogram bins of the re-solved total flow. Default 20.' })),
    priceAtP90: Type.Optional(Type.Boolean({ description: 'Also price the bid summary at the P90 total flow. Default false.' })),
  },
  { additionalProperties: false, description: 'Monte Carlo analysis of K (and S): probability the chosen rates meet every target, P50/P90 of the total flow needed.' },
);

export const RobustOptionsSchema = Type.Object(
  {
    oneWellOut: Type.Optional(Type.Boolean({ description: 'Offer a design that meets every target with any one well out of service (N − 1). Default false.' })),
    conductivityFactor: Type.Optional(
      Type.Number({ minimum: 1, maximum: MAX_SCALE_FACTOR, description: 'Offer a design that meets every target for K anywhere from K ÷ f to K × f (both ends solved at once). Absent: none.' }),
    ),
  },
  { additionalProperties: false, description: 'Robust design options, each solved beside the ordinary design with the extra flow it costs.' },
);

export const DESIGN_UNCERTAINTY_OPTION_FIELDS = {
  sensitivity: Type.Optional(SensitivityOptionsSchema),
  monteCarlo: Type.Optional(MonteCarloOptionsSchema),
  robust: Type.Optional(RobustOptionsSchema),
};
