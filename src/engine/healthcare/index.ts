/** Hospital and ICU demand against capacity (issue 4). */
export * from './defaults.ts';
export { delayKernel, bedDayKernel, expectedTimeInBedBy, TAIL_TOLERANCE } from './kernels.ts';
export { prepareHealthcare, type PreparedHealthcare, type DelayGroup } from './prepareHealthcare.ts';
export { healthcareDemand } from './demand.ts';
export { bedDemand } from './capacity.ts';
export { healthcareProblems } from './healthcareProblems.ts';
