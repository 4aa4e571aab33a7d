/**
 * Beds in use against beds available: the peak, and how long and by how much demand exceeds
 * capacity. Occupancy is the mean number of beds in use during each day (persons), so one day
 * with occupancy x above capacity c adds x - c patient-days above capacity.
 */
import type { BedDemand } from '../results.ts';

/**
 * Peak, its day (the first day it is reached) and the excess over usual and surge capacity: days
 * with occupancy > beds, and the sum over days of max(0, occupancy - beds) (patient-days, summed
 * in day order). One pass over the days for all of them.
 */
export function bedDemand(occupancy: Float64Array, beds: number, surgeBeds: number | null): BedDemand {
  const surgeLevel = surgeBeds ?? Infinity;
  let peakDay = 0;
  let peak = occupancy.length > 0 ? occupancy[0] : 0;
  let days = 0;
  let patientDays = 0;
  let firstDay: number | null = null;
  let surgeDays = 0;
  let surgePatientDays = 0;
  for (let d = 0; d < occupancy.length; d++) {
    const x = occupancy[d];
    if (x > peak) {
      peak = x;
      peakDay = d;
    }
    const over = x - beds;
    if (over > 0) {
      days++;
      patientDays += over;
      if (firstDay === null) firstDay = d;
    }
    const overSurge = x - surgeLevel;
    if (overSurge > 0) {
      surgeDays++;
      surgePatientDays += overSurge;
    }
  }
  return {
    capacityBeds: beds,
    surgeCapacityBeds: surgeBeds,
    peakOccupancy: peak,
    peakDay,
    daysOverCapacity: days,
    patientDaysOverCapacity: patientDays,
    firstDayOverCapacity: firstDay,
    daysOverSurgeCapacity: surgeBeds === null ? null : surgeDays,
    patientDaysOverSurgeCapacity: surgeBeds === null ? null : surgePatientDays,
  };
}
