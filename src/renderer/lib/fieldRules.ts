/**
 * The rules of the app's number fields for scenario values. Each field checks a typed value with
 * the very schema the file reader applies to that field (src/engine/scenario.ts and the schemas of
 * its sections, whose bounds are the plausibility bounds of src/engine/limits.ts): a value a field
 * accepts is one the file reader accepts and the other way round, and the field's message names
 * the broken rule in the reader's words ("must be at least 0.1 days"). Rules that tie fields
 * together (efficacy against death at least against infection, days within the horizon) stay with
 * the check of the whole edited scenario (editCheck.ts).
 */
import { fieldRuleBroken, campaignSchema, delaySchema, diseaseSchema, distributionSchema, doseStepSchema, healthcareSchema, initialStateSchema, phaseSchema, ageFactorSchema, scenarioSchema, severitySchema, transmissionSchema, uncertaintySchema, bedCapacitySchema } from '../../engine/index.ts';

/** What a field needs of a zod number schema (zod 4's `minValue`, `maxValue`, `isInt`), besides being one. */
type NumberSchema = Parameters<typeof fieldRuleBroken>[0] & {
  readonly minValue: number | null;
  readonly maxValue: number | null;
  readonly isInt: boolean;
};

/** A field's rule: its bounds (in the stored unit; an end may be excluded, see `problem`) and the check. */
export interface FieldRule {
  min: number;
  max: number;
  integer: boolean;
  /** The rule `stored` breaks, in the file reader's words (`must be at most 100`), or null when the reader accepts it. */
  problem(stored: number): string | null;
}

function ruleOf(schema: NumberSchema): FieldRule {
  return {
    min: schema.minValue ?? -Infinity,
    max: schema.maxValue ?? Infinity,
    integer: schema.isInt,
    problem: (stored) => fieldRuleBroken(schema, stored),
  };
}

const [r0Schema, doublingSchema] = transmissionSchema.options;
const [uniform, , normal, lognormal] = distributionSchema.options;

/** Every number field of the app that edits a scenario value, by the value it edits. */
export const FIELD_RULES = {
  populationPersons: ruleOf(scenarioSchema.shape.populationPersons.element),
  infectedPersons: ruleOf(initialStateSchema.shape.infectedPersons.element),
  priorImmunityFraction: ruleOf(initialStateSchema.shape.priorImmunityFraction.unwrap().element),
  infectionFatalityRatio: ruleOf(severitySchema.shape.infectionFatalityRatio.element),
  relativeSusceptibility: ruleOf(diseaseSchema.shape.relativeSusceptibility.unwrap().element),
  relativeInfectiousness: ruleOf(diseaseSchema.shape.relativeInfectiousness.unwrap().element),
  r0: ruleOf(r0Schema.shape.r0),
  doublingTimeDays: ruleOf(doublingSchema.shape.doublingTimeDays),
  latentPeriodDays: ruleOf(diseaseSchema.shape.latentPeriodDays),
  infectiousPeriodDays: ruleOf(diseaseSchema.shape.infectiousPeriodDays),
  latentStages: ruleOf(diseaseSchema.shape.latentStages.unwrap()),
  infectiousStages: ruleOf(diseaseSchema.shape.infectiousStages.unwrap()),
  delayMeanDays: ruleOf(delaySchema.shape.meanDays),
  delayShape: ruleOf(delaySchema.shape.shape.unwrap()),
  horizonDays: ruleOf(scenarioSchema.shape.horizonDays),
  contactMultiplier: ruleOf(phaseSchema.shape.settingMultipliers.unwrap().valueType),
  caseIsolation: ruleOf(phaseSchema.shape.caseIsolation.unwrap()),
  ageFactor: ruleOf(ageFactorSchema.shape.factor),
  triggerLevel: ruleOf(phaseSchema.shape.trigger.unwrap().shape.onAbove),
  triggerDays: ruleOf(phaseSchema.shape.trigger.unwrap().shape.lagDays.unwrap()),
  beds: ruleOf(bedCapacitySchema.shape.wardBeds),
  hospitalRatio: ruleOf(healthcareSchema.shape.infectionHospitalisationRatio.unwrap().element),
  delayToProtectionDays: ruleOf(campaignSchema.shape.delayToProtectionDays.unwrap()),
  efficacy: ruleOf(campaignSchema.shape.efficacyAgainstInfection),
  uptakeCeiling: ruleOf(campaignSchema.shape.uptakeCeiling.element),
  doseStepDay: ruleOf(doseStepSchema.shape.fromDay),
  dosesPerDay: ruleOf(doseStepSchema.shape.dosesPerDay),
  draws: ruleOf(uncertaintySchema.shape.draws.unwrap()),
  seed: ruleOf(uncertaintySchema.shape.seed.unwrap()),
  intervalLevel: ruleOf(uncertaintySchema.shape.intervalLevel.unwrap()),
  distributionValue: ruleOf(uniform.shape.low),
  distributionSd: ruleOf(normal.shape.sd),
  distributionPositive: ruleOf(lognormal.shape.median),
  geometricSd: ruleOf(lognormal.shape.geometricSd.unwrap()),
} satisfies Record<string, FieldRule>;

export type FieldName = keyof typeof FIELD_RULES;

/** Bounds shown to the reader: 1000, 0.1, 1e10 (as limits.ts shows them). */
function shownBound(x: number): string {
  return Math.abs(x) >= 1e6 ? x.toExponential().replace('e+', 'e') : String(Number(x.toPrecision(10)));
}

/**
 * The message of a field whose typed value (`shown`, in the field's unit: stored x `scale`)
 * breaks its rule, or null: `Latent period must be at least 0.1 days, got 0.05 days.` A field
 * shown in another unit than stored (a fraction in %) adds its bounds in the shown unit.
 */
export function fieldProblem(rule: FieldRule, label: string, shown: number, scale = 1, unit = ''): string | null {
  const broken = rule.problem(shown / scale);
  if (broken === null) return null;
  const inUnit = (x: number) => `${shownBound(x)}${unit === '' ? '' : ` ${unit}`}`;
  const here = scale === 1 ? '' : ` (${inUnit(rule.min * scale)} to ${inUnit(rule.max * scale)} here)`;
  return `${label} ${broken}${here}, got ${inUnit(shown)}.`;
}
