/**
 * A vaccination campaign in the scenario file. Options refer to a campaign by name, so several
 * options can share one (e.g. the same supply under different contact measures).
 */
import { z } from 'zod';
import { MAX_DAY_NUMBER, MAX_DELAY_TO_PROTECTION_DAYS, MAX_DOSES_PER_DAY, between } from '../limits.ts';

const fraction = z.number({ message: 'must be a number' }).min(0, { message: 'must be a fraction between 0 and 1' }).max(1, { message: 'must be a fraction between 0 and 1' });

/** From `fromDay` on (until the next step), `dosesPerDay` doses are given each day. */
export const doseStepSchema = z.object({
  fromDay: z
    .number()
    .int({ message: 'must be a whole number of days' })
    .min(0, { message: 'must be >= 0' })
    .max(MAX_DAY_NUMBER, { message: `must be at most ${MAX_DAY_NUMBER} (a day number)` }),
  dosesPerDay: between(0, MAX_DOSES_PER_DAY, 'doses per day'),
});

export const campaignSchema = z.object({
  name: z.string().min(1, { message: 'must not be empty' }),
  /** Stepwise supply: the first step's day is the start day. One step = a constant rate. */
  schedule: z.array(doseStepSchema).min(1, { message: 'must have at least one step' }),
  /** Largest fraction of each band that will take a dose (fraction 0-1, one per band). */
  uptakeCeiling: z.array(fraction),
  /**
   * Mean delay from dose to protection, days (exponentially distributed). At least 1 day: a shorter
   * delay makes the system stiff for the explicit integrator and is not how vaccines work.
   */
  delayToProtectionDays: z
    .number({ message: 'must be a number' })
    .min(1, { message: 'must be at least 1 day' })
    .max(MAX_DELAY_TO_PROTECTION_DAYS, { message: `must be at most ${MAX_DELAY_TO_PROTECTION_DAYS} days` })
    .default(14),
  /** Vaccine efficacy against infection, fraction 0-1. */
  efficacyAgainstInfection: fraction,
  /** Vaccine efficacy against death, fraction 0-1, at least the efficacy against infection. */
  efficacyAgainstDeath: fraction,
  /** Vaccine efficacy against hospital admission, fraction 0-1 (defaults to the efficacy against death). */
  efficacyAgainstAdmission: fraction.optional(),
  /** Leaky: every protected person's risk is cut by the efficacy. All-or-nothing: that share is fully immune, the rest not at all. */
  protection: z.enum(['leaky', 'allOrNothing']).default('leaky'),
  /** Priority order: groups of band indices (0-based); doses go to the first group until its ceiling is met, then the next. */
  priority: z.array(z.array(z.number().int().min(0)).min(1, { message: 'must name at least one band' })).min(1, { message: 'must have at least one group' }),
  source: z.string().default(''),
});

export type Campaign = z.output<typeof campaignSchema>;
export type CampaignInput = z.input<typeof campaignSchema>;
