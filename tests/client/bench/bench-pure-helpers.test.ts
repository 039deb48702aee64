import { describe, expect, it } from 'vitest';
import { PlanSchema, evaluate, initialState } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import { HISTORY_LIMIT, emptyHistory, recordEdit, redoStep, undoStep } from '@/bench/edit-history';
import { highlightOf, keptSelection } from '@/bench/bench-selection';
import { refusalOf } from '@/bench/edit-refusal';
import { editCommands } from '@/bench/edit-commands';
import * as edits from '@/bench/plan-edits';
import { twoSetPlan } from './bench-fixture';

function renamed(name: string) {
  return { ...twoSetPlan(), name };
}

describe('edit history', () => {
  it('undoes to the document before the edit and redoes back to the one after', () => {
    const before = renamed('before');
    const after = renamed('after');
    const history = recordEdit(emptyHistory(), 'Rename', before);
    expect(history.past.map((e) => e.label)).toEqual(['Rename']);

    const back = undoStep(history, after);
    expect(back?.plan).toBe(before);
    expect(back?.history).toEqual({ past: [], future: [{ label: 'Rename', plan: after }] });

    const again = back && redoStep(back.history, before);
    expect(again?.plan).toBe(after);
    expect(again?.history).toEqual({ past: [{ label: 'Rename', plan: before }], future: [] });
  });

  it('has nothing to undo or redo on an empty history', () => {
    expect(undoStep(emptyHistory(), renamed('x'))).toBeNull();
    expect(redoStep(emptyHistory(), renamed('x'))).toBeNull();
  });

  it('drops the redo branch on a new edit and keeps only the newest edits', () => {
    const plan = renamed('p');
    const undone = undoStep(recordEdit(emptyHistory(), 'Move', plan), plan);
    expect(undone?.history.future).toHaveLength(1);
    expect(recordEdit(undone!.history, 'Lift', plan).future).toEqual([]);

    let long = emptyHistory();
    for (let i = 0; i <= HISTORY_LIMIT; i += 1) long = recordEdit(long, `Edit ${i}`, plan);
    expect(long.past).toHaveLength(HISTORY_LIMIT);
    expect(long.past[0].label).toBe('Edit 1'); // the oldest of limit + 1 edits is the one dropped
  });
});

describe('selection helpers', () => {
  it('lights every part and cable on a finding’s path and the sets it names', () => {
    const plan = PlanSchema.parse(demo);
    const finding = evaluate(plan, initialState(plan)).findings.find((f) => f.path.some((h) => h.cable));
    expect(finding).toBeDefined();
    const { parts, cables } = highlightOf(finding!);
    for (const hop of finding!.path) {
      expect(parts.has(hop.part)).toBe(true);
      if (hop.cable) expect(cables.has(hop.cable)).toBe(true);
    }
    for (const set of finding!.sets) expect(parts.has(set)).toBe(true);
    expect(highlightOf(null)).toEqual({ parts: new Set(), cables: new Set() });
  });

  it('keeps a selected part only while it is in the plan', () => {
    const plan = twoSetPlan();
    expect(keptSelection(plan, 'front')).toBe('front');
    expect(keptSelection(plan, 'gone')).toBeNull();
    expect(keptSelection(plan, null)).toBeNull();
  });
});

describe('edit refusal', () => {
  it('refuses every edit on a read-only plan with its reason, then the edit’s own refusal', () => {
    const plan = twoSetPlan();
    const accepted = edits.renamePart(plan, 'front', 'Desk');
    expect(accepted.ok).toBe(true);
    expect(refusalOf('Shared with you to view', accepted)).toEqual({
      ok: false,
      reason: 'Shared with you to view',
    });
    expect(refusalOf(null, accepted)).toBeNull();
    const refused = { ok: false as const, reason: 'No such part' };
    expect(refusalOf(null, refused)).toBe(refused);
  });
});

describe('edit commands', () => {
  it('apply each edit to the current plan and hand the outcome to the recorder', () => {
    const plan = twoSetPlan();
    const seen: string[] = [];
    const commands = editCommands(
      () => plan,
      (outcome) => {
        seen.push(outcome.ok ? outcome.label : outcome.reason);
        return outcome.ok ? { ok: true } : outcome;
      },
      (outcome) => (outcome.ok ? (outcome.id ?? null) : null),
    );
    expect(commands.renamePart('front', 'Desk')).toEqual({ ok: true });
    expect(seen).toEqual([(edits.renamePart(plan, 'front', 'Desk') as { label: string }).label]);
    expect(commands.addSet('six-key', { x: 0, y: 0 })).toBe('set-1'); // first free id, as plan-edits gives it
    expect(commands.duplicatePart('front')).toMatchObject({ ok: true });
  });
});
