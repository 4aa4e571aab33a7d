/**
 * A campaign readied for the simulation: its dose plan and the risk factors for infections that
 * happen despite protection.
 *
 * Efficacy against death e_D is the cut in the risk of dying for a protected person compared with
 * an unvaccinated one, infection included: (1 - e_D) = (1 - e_I) x f_D, where f_D is the relative
 * fatality of an infection in a protected person. So f_D = (1 - e_D) / (1 - e_I) (validation keeps
 * e_D >= e_I, so f_D <= 1); the same for admission. With e_I = 1 nobody protected is infected and
 * f is irrelevant (0). The same relation holds for all-or-nothing protection, where the protected
 * who are infected are the vaccine's failures.
 */
import type { Campaign } from './schema.ts';
import type { VaccineEffect } from '../seir.ts';
import { type DosePiece, dosePlan } from './dosePlan.ts';

export interface PreparedCampaign {
  campaign: Campaign;
  plan: DosePiece[];
  vaccine: VaccineEffect;
  /** f_D: relative IFR of an infection in a protected person. */
  deathRiskFactor: number;
  /** f_H: relative infection-hospitalisation ratio of an infection in a protected person. */
  admissionRiskFactor: number;
}

/** (1 - e_outcome) / (1 - e_infection), or 0 when e_infection = 1. */
export function relativeRiskGivenInfection(efficacyAgainstOutcome: number, efficacyAgainstInfection: number): number {
  return efficacyAgainstInfection < 1 ? (1 - efficacyAgainstOutcome) / (1 - efficacyAgainstInfection) : 0;
}

export function prepareCampaign(c: Campaign, population: ArrayLike<number>, horizonDays: number): PreparedCampaign {
  return {
    campaign: c,
    plan: dosePlan(c, population, horizonDays),
    vaccine: { efficacyAgainstInfection: c.efficacyAgainstInfection, protection: c.protection, delayToProtectionDays: c.delayToProtectionDays },
    deathRiskFactor: relativeRiskGivenInfection(c.efficacyAgainstDeath, c.efficacyAgainstInfection),
    admissionRiskFactor: relativeRiskGivenInfection(c.efficacyAgainstAdmission ?? c.efficacyAgainstDeath, c.efficacyAgainstInfection),
  };
}
