/** Training: fault puzzles and demonstrations as data, with the pure checker and grader (engine public API only). */
export * from './puzzle.schema';
export * from './demonstration.schema';
export * from './faults';
export * from './sightings';
export * from './grade';
export { SHIPPED_PUZZLES } from './puzzles/catalogue';
