/**
 * The optional `uncertainty` section of a scenario: which inputs are uncertain, how each is
 * distributed, and how many Latin hypercube draws to take (the method: `ensemble.ts`). Every
 * parameter carries the source of its range, which the report prints.
 */
import { z } from 'zod';
import { MAX_DISTRIBUTION_VALUE, MAX_DRAWS, MAX_GEOMETRIC_SD, aboveZero, between } from '../limits.ts';

export { MAX_DRAWS };

/** A value in the unit of the input it sets or scales (limits.ts). */
const finite = between(-MAX_DISTRIBUTION_VALUE, MAX_DISTRIBUTION_VALUE, '');
const positive = aboveZero(MAX_DISTRIBUTION_VALUE, '');

/** Parameters that set a value of the scenario (units as the field they replace). */
export const VALUE_PARAMETERS = ['r0', 'doublingTimeDays', 'latentPeriodDays', 'infectiousPeriodDays'] as const;
/** Parameters that multiply inputs of the scenario (dimensionless factors) or set the adherence share. */
export const FACTOR_PARAMETERS = [
  'ifrScale',
  'hospitalisationScale',
  'icuShareScale',
  'wardStayScale',
  'icuStayScale',
  'measureAdherence',
  'vaccineEfficacyScale',
  'initialInfectedScale',
] as const;
/** `contactScale.<setting>` multiplies one setting's contact matrix. */
export const CONTACT_SCALE_PREFIX = 'contactScale.';

export const PARAMETER_NAMES_TEXT = `${[...VALUE_PARAMETERS, ...FACTOR_PARAMETERS].join(', ')} or ${CONTACT_SCALE_PREFIX}<setting>`;
const NAME_RULE = `must be one of ${PARAMETER_NAMES_TEXT}`;

/** Uniform on [low, high]. */
const uniformSchema = z.strictObject({ kind: z.literal('uniform'), low: finite, high: finite });
/** Triangular on [low, high] with its mode (most likely value) at `mode`. */
const triangularSchema = z.strictObject({ kind: z.literal('triangular'), low: finite, mode: finite, high: finite });
/** Normal with mean and standard deviation, optionally truncated to [low, high] (either end may be open). */
const normalSchema = z.strictObject({ kind: z.literal('normal'), mean: finite, sd: positive, low: finite.optional(), high: finite.optional() });
/**
 * Lognormal given by its median and either a central 95% range [low, high] or a geometric
 * standard deviation (> 1): ln X ~ Normal(ln median, sigma), sigma = ln(geometricSd), or
 * sigma = ln(high / low) / (2 x 1.959964) from the range.
 */
const lognormalSchema = z.strictObject({
  kind: z.literal('lognormal'),
  median: positive,
  range95: z.tuple([positive, positive]).optional(),
  geometricSd: z.number({ message: 'must be a number' }).gt(1, { message: 'must be > 1' }).max(MAX_GEOMETRIC_SD, { message: `must be at most ${MAX_GEOMETRIC_SD}` }).optional(),
});

export const distributionSchema = z.discriminatedUnion('kind', [uniformSchema, triangularSchema, normalSchema, lognormalSchema], {
  message: 'must be "uniform", "triangular", "normal" or "lognormal"',
});

export const uncertainParameterSchema = z.strictObject({
  /** Which input is uncertain: one of PARAMETER_NAMES_TEXT. */
  name: z.union([z.enum([...VALUE_PARAMETERS, ...FACTOR_PARAMETERS], { message: NAME_RULE }), z.string().regex(/^contactScale\..+$/, { message: NAME_RULE })], { message: NAME_RULE }),
  distribution: distributionSchema,
  /** Where the range comes from (printed in the report). */
  source: z.string({ message: 'must be text' }).min(1, { message: 'must say where the range comes from' }),
});

export const uncertaintySchema = z.strictObject({
  /** Number of Latin hypercube draws. */
  draws: z.number({ message: 'must be a number' }).int({ message: 'must be a whole number' }).min(2, { message: 'must be at least 2' }).max(MAX_DRAWS, { message: `must be at most ${MAX_DRAWS}` }).default(1000),
  /** Seed of the generator: a whole number 0 .. 2^53 - 1. The same seed gives the same draws. */
  seed: z.number({ message: 'must be a number' }).int({ message: 'must be a whole number' }).min(0, { message: 'must be >= 0' }).max(Number.MAX_SAFE_INTEGER, { message: 'must be at most 2^53 - 1' }).default(1),
  /** Central share of the draws an interval covers, e.g. 0.9 for the 5th to 95th percentile. */
  intervalLevel: z.number({ message: 'must be a number' }).gt(0, { message: 'must be between 0 and 1 (exclusive)' }).lt(1, { message: 'must be between 0 and 1 (exclusive)' }).default(0.9),
  parameters: z.array(uncertainParameterSchema).min(1, { message: 'must list at least one uncertain parameter' }),
});

export type Distribution = z.output<typeof distributionSchema>;
export type UncertainParameter = z.output<typeof uncertainParameterSchema>;
export type Uncertainty = z.output<typeof uncertaintySchema>;
export type UncertaintyInput = z.input<typeof uncertaintySchema>;
