/**
 * The Bench's edit commands: each binds one pure edit of plan-edits.ts to the open plan and to the store's way of
 * recording it, so the store lists them once and the edits themselves stay plan in, plan out.
 */
import type { CureResult, Plan, PortRef } from '@shared/engine';
import * as edits from './plan-edits';
import type { CureApplier, EditOutcome, Position } from './plan-edits';
import type { EditResult } from './edit-refusal';

export function editCommands(
  current: () => Plan,
  run: (outcome: EditOutcome) => EditResult,
  runAdd: (outcome: EditOutcome) => string | null,
) {
  const partName = (id: string) => edits.partName(current(), id);
  const addSet = (template: string, position: Position) =>
    runAdd(edits.addSet(current(), template, position));
  const addAdapter = (template: string, position: Position) =>
    runAdd(edits.addAdapter(current(), template, position));
  const addAddOn = (template: string, serves: string, position: Position) =>
    runAdd(edits.addAddOn(current(), template, serves, position));
  const moveParts = (moves: { id: string; position: Position }[]) => run(edits.moveParts(current(), moves));
  const movePart = (id: string, position: Position) => moveParts([{ id, position }]);
  const renamePart = (id: string, name: string) => run(edits.renamePart(current(), id, name));

  const connect = (a: PortRef, b: PortRef) => run(edits.connect(current(), a, b));
  const liftLead = (id: string, pair: number, conductor: 'tip' | 'ring' | 'both' = 'both') =>
    run(edits.liftLead(current(), id, pair, conductor));
  const moveLead = (id: string, pair: number, toPair: number) =>
    run(edits.moveLead(current(), id, pair, toPair));
  const restoreLead = (id: string, pair: number) => run(edits.restoreLead(current(), id, pair));
  const updateSet = (id: string, patch: Parameters<typeof edits.updateSet>[2]) =>
    run(edits.updateSet(current(), id, patch));
  const setAddOnServes = (id: string, serves: string) => run(edits.setAddOnServes(current(), id, serves));
  const setLineCount = (count: number) => run(edits.setLineCount(current(), count));
  const setPortCount = (count: number) => run(edits.setPortCount(current(), count));
  const addStation = (code: string, label: string) => run(edits.addStation(current(), code, label));
  const removeStation = (stationId: string) => run(edits.removeStation(current(), stationId));
  const applyCure = (result: CureResult, withCure: CureApplier) =>
    run(edits.applyCure(current(), result, withCure));

  function duplicatePart(id: string): { ok: true; id: string } | { ok: false; reason: string } {
    const outcome = edits.duplicatePart(current(), id);
    const result = run(outcome);
    if (!result.ok) return result;
    return { ok: true, id: (outcome.ok && outcome.id) || id };
  }

  return {
    partName,
    duplicatePart,
    addSet,
    addAdapter,
    addAddOn,
    moveParts,
    movePart,
    renamePart,
    connect,
    liftLead,
    moveLead,
    restoreLead,
    updateSet,
    setAddOnServes,
    setLineCount,
    setPortCount,
    addStation,
    removeStation,
    applyCure,
  };
}
