/** Messages between the Bench and its sweep worker. */
import type { CureResult, Plan, SweepResult } from '@shared/engine';

export type SweepRequest =
  { type: 'sweep'; id: number; plan: Plan; limit?: number } | { type: 'cure'; id: number; plan: Plan };

export type SweepReply =
  | { type: 'progress'; id: number; done: number; total: number }
  | { type: 'sweep-done'; id: number; result: SweepResult }
  | { type: 'cure-done'; id: number; result: CureResult }
  | { type: 'failed'; id: number; message: string };
