/**
 * Default hospital parameters, each with its source.
 *
 * Severity by age: Ferguson NM et al. 2020, Impact of non-pharmaceutical interventions (NPIs) to
 * reduce COVID-19 mortality and healthcare demand, Imperial College COVID-19 Response Team
 * Report 9, Table 1. For ten-year bands 0-9, 10-19, ..., 70-79, 80+ it gives
 * - the share of SYMPTOMATIC cases that need hospital care (%), and
 * - the share of those hospitalised who need critical care (%).
 *
 * Per symptomatic case -> per infection: the infection-hospitalisation ratio is
 *   IHR_a = symptomatic share x (hospitalised % of symptomatic)_a / 100,
 * assuming infections without symptoms are never admitted. Symptomatic share 0.8 = 1 - 0.20, the
 * summary proportion of infections that stay asymptomatic throughout (20%, 95% CI 17-25%) in
 * Buitrago-Garcia D et al. 2020, Occurrence and transmission potential of asymptomatic and
 * presymptomatic SARS-CoV-2 infections: a living systematic review and meta-analysis,
 * PLoS Med 17(9):e1003346. The same share is used for every age (the review gives no age split).
 * The ICU share is a share of admissions, so it needs no conversion.
 *
 * Ten-year bands -> the scenario's bands, by lower age: a band takes the values of the ten-year
 * band that contains its lower age (0-4 and 5-9 both take 0-9; 75+ takes 70-79; any band from
 * 80 up takes 80+). A wide top band therefore gets the value of its youngest ages; give the
 * ratios explicitly if that understates it.
 */
/**
 * A gamma delay as the scenario's `delaySchema` reads it (mean in days, shape). Written out here
 * rather than imported so the scenario schema can take its defaults from this module without an
 * import cycle.
 */
type Delay = Readonly<{ meanDays: number; shape: number }>;
/** The part of a scenario the default ratios need. */
type Banded = { ageBands: readonly { label: string; lowerAgeYears: number }[] };

/** Report 9 Table 1 (Ferguson et al. 2020): lower ages of the ten-year bands, years. */
export const REPORT9_LOWER_AGES = [0, 10, 20, 30, 40, 50, 60, 70, 80] as const;
/** Report 9 Table 1: % of symptomatic cases requiring hospitalisation, 0-9 ... 80+. */
export const REPORT9_HOSPITALISED_PERCENT_OF_SYMPTOMATIC = [0.1, 0.3, 1.2, 3.2, 4.9, 10.2, 16.6, 24.3, 27.3] as const;
/** Report 9 Table 1: % of hospitalised cases requiring critical care, 0-9 ... 80+. */
export const REPORT9_CRITICAL_CARE_PERCENT_OF_HOSPITALISED = [5, 5, 5, 5, 6.3, 12.2, 27.4, 43.2, 70.9] as const;

/** Share of infections with symptoms: 1 - 0.20 (Buitrago-Garcia et al. 2020, PLoS Med 17:e1003346). */
export const SYMPTOMATIC_SHARE = 0.8;

/**
 * Infection to admission, days. Mean 10 = incubation (median 5.1 days, Lauer SA et al. 2020,
 * Ann Intern Med 172:577) + symptom onset to admission (5 days as assumed in Report 9, from
 * memory). Shape 4 (coefficient of variation 0.5) is our assumption, no source.
 */
export const DEFAULT_ADMISSION_DELAY: Delay = { meanDays: 10, shape: 4 };
/**
 * Ward stay of patients who do not need ICU, days. Mean 8: Report 9 (Ferguson et al. 2020)
 * assumes 8 days in hospital when critical care is not needed. Shape 2: a gamma with shape 2
 * has upper/lower quartile ratio 2.8, close to the interquartile ranges pooled by Rees EM et al.
 * 2020, COVID-19 length of hospital stay: a systematic review and data synthesis, BMC Med 18:270
 * (hospital 5 (3-9) days, ICU 7 (4-11) days outside China; journal details from memory).
 */
export const DEFAULT_WARD_STAY: Delay = { meanDays: 8, shape: 2 };
/** ICU stay, days. Mean 10: Report 9 (10 of 16 days in hospital in ICU). Shape 2: as the ward stay (Rees et al. 2020). */
export const DEFAULT_ICU_STAY: Delay = { meanDays: 10, shape: 2 };
/** Ward days of ICU patients outside ICU, days. Mean 6 = 16 - 10 days in Report 9. Shape 2: as above. */
export const DEFAULT_ICU_PATIENT_WARD_STAY: Delay = { meanDays: 6, shape: 2 };

/** Index of the Report 9 ten-year band that contains `lowerAgeYears`. */
export function report9BandOf(lowerAgeYears: number): number {
  return Math.min(REPORT9_LOWER_AGES.length - 1, Math.max(0, Math.floor(lowerAgeYears / 10)));
}

/** Default IHR by scenario band, fraction: symptomatic share x Report 9 hospitalised % / 100. */
export function defaultInfectionHospitalisationRatio(s: Banded): number[] {
  return s.ageBands.map((b) => (SYMPTOMATIC_SHARE * REPORT9_HOSPITALISED_PERCENT_OF_SYMPTOMATIC[report9BandOf(b.lowerAgeYears)]) / 100);
}

/** Default share of admissions needing ICU by scenario band, fraction: Report 9 critical care % / 100. */
export function defaultIcuShareOfAdmissions(s: Banded): number[] {
  return s.ageBands.map((b) => REPORT9_CRITICAL_CARE_PERCENT_OF_HOSPITALISED[report9BandOf(b.lowerAgeYears)] / 100);
}

/** The delays given once for every band, or their defaults where the scenario does not give them. */
export function commonDelays(h: { admissionDelay?: Delay; wardStay?: Delay; icuStay?: Delay }): { admissionDelay: Delay; wardStay: Delay; icuStay: Delay } {
  return { admissionDelay: h.admissionDelay ?? DEFAULT_ADMISSION_DELAY, wardStay: h.wardStay ?? DEFAULT_WARD_STAY, icuStay: h.icuStay ?? DEFAULT_ICU_STAY };
}
