/**
 * Beds in use against beds available: the peak, and how long and by how much demand exceeds
 * capacity. Occupancy is the mean number of beds in use during each day (persons), so one day
 * with occupancy x above capacity c adds x - c patient-days above capacity.
 */
import type { BedDemand } from '../results.ts';

/** Days with occupancy > beds, and sum over days of max(0, occupancy - beds) (patient-days). */
function excess(occupancy: Float64Array, beds: number): { days: number; patientDays: number; firstDay: number | null } {
  let days = 0;
  let patientDays = 0;
  let firstDay: number | null = null;
  for (let d = 0; d < occupancy.length; d++) {
    const over = occupancy[d] - beds;
    if (over > 0) {
      days++;
      patientDays += over;
      if (firstDay === null) firstDay = d;
    }
  }
  return { days, patientDays, firstDay };
}

/** Peak, its day (the first day it is reached) and the excess over usual and surge capacity. */
export function bedDemand(occupancy: Float64Array, beds: number, surgeBeds: number | null): BedDemand {
  let peakDay = 0;
  for (let d = 1; d < occupancy.length; d++) if (occupancy[d] > occupancy[peakDay]) peakDay = d;
  const usual = excess(occupancy, beds);
  const surge = surgeBeds === null ? null : excess(occupancy, surgeBeds);
  return {
    capacityBeds: beds,
    surgeCapacityBeds: surgeBeds,
    peakOccupancy: occupancy.length > 0 ? occupancy[peakDay] : 0,
    peakDay,
    daysOverCapacity: usual.days,
    patientDaysOverCapacity: usual.patientDays,
    firstDayOverCapacity: usual.firstDay,
    daysOverSurgeCapacity: surge?.days ?? null,
    patientDaysOverSurgeCapacity: surge?.patientDays ?? null,
  };
}
