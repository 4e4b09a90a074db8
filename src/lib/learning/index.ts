/** The learner's scheduling, ability and readiness: pure functions over plain data the server stores. */
export * from './learning-day';
export * from './rasch';
export * from './schedule';
export * from './daily-set';
export * from './placement';
export * from './mock-exam';
export * from './readiness';
export * from './progress';
export { makeRng, seedFrom, type Rng } from './rng';
