/**
 * Facts the library lists beside a plan, worked out by the engine when the plan is written.
 * Open faults: distinct faults a bounded sweep finds. The bound keeps a save quick on plans up to the set
 * limit (the 60-set sweep to 2 000 states takes about 0.15 s here); a plan with more states may hide a few.
 */
import { sweep, type Plan } from '../../shared/engine/index';

export const FAULT_SWEEP_STATES = 2000;

export function openFaultCount(plan: Plan): number {
  const result = sweep(plan, { limit: FAULT_SWEEP_STATES });
  return result.findings.filter((f) => f.finding.severity === 'fault').length;
}
