/** Messages between the Bench and its engine worker (sweeps and cures). */
import type { OptimalCureResult, Plan, SweepResult } from '@shared/engine';

/** The user's choices for a cure: sets whose hands-free add-on must keep working, sets not to be touched. */
export interface CureChoices {
  keepAddOn: string[];
  untouched: string[];
}

export type EngineRequest =
  | { type: 'sweep'; id: number; plan: Plan; limit?: number }
  | { type: 'cure'; id: number; plan: Plan; choices: CureChoices };

export type EngineReply =
  | { type: 'progress'; id: number; done: number; total: number }
  | { type: 'sweep-done'; id: number; result: SweepResult }
  | { type: 'cure-done'; id: number; result: OptimalCureResult }
  | { type: 'failed'; id: number; message: string };
