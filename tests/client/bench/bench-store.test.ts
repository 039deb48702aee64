import { isProxy, reactive, readonly } from 'vue';
import { describe, expect, it } from 'vitest';
import { benchWith, twoSetPlan } from './bench-fixture';

describe('bench store history', () => {
  it('undoes and redoes each edit in order, with its label', () => {
    const store = benchWith();
    const original = store.plan;
    const id = store.addSet('ten-key', { x: 100, y: 100 }) ?? 'refused';
    expect(id).toBe('set-1');
    store.renamePart(id, 'Workshop');
    expect(store.plan?.sets).toHaveLength(3);
    expect(store.undoLabel).toBe('Rename Set 3 to Workshop');

    store.undo();
    expect(store.plan?.sets.find((s) => s.id === id)?.name).toBe('Set 3');
    expect(store.redoLabel).toBe('Rename Set 3 to Workshop');
    store.undo();
    expect(store.plan).toBe(original);
    expect(store.canUndo).toBe(false);

    store.redo();
    store.redo();
    expect(store.plan?.sets.find((s) => s.id === id)?.name).toBe('Workshop');
    expect(store.canRedo).toBe(false);
  });

  it('drops the redo branch when a new edit is made after undo', () => {
    const store = benchWith();
    store.movePart('front', { x: 640, y: 40 });
    store.undo();
    expect(store.canRedo).toBe(true);
    store.liftLead('front', 1);
    expect(store.canRedo).toBe(false);
    expect(store.past.map((e) => e.label)).toEqual(['Lift pair 1 in Front desk']);
  });

  it('counts document revisions for autosave, including undo and redo, but not operating the sets', () => {
    const store = benchWith();
    store.operate({ kind: 'lift-handset', set: 'front' });
    expect(store.revision).toBe(0);
    store.liftLead('front', 3, 'tip');
    store.undo();
    store.redo();
    expect(store.revision).toBe(3);
  });

  it('refuses a cable the engine refuses and records nothing', () => {
    const store = benchWith();
    const before = store.plan;
    // A port takes one cable: the front set's cord is already plugged in (rule of the plan document).
    const result = store.connect({ part: 'front', port: 'cord' }, { part: 'ksu', port: 'port-2' });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason.length).toBeGreaterThan(0);
    expect(store.plan).toBe(before);
    expect(store.canUndo).toBe(false);
  });

  it('deleting a part takes its cables with it, and undo brings both back', () => {
    const store = benchWith();
    store.removePart('bridge');
    expect(store.plan?.adapters).toHaveLength(0);
    expect(store.plan?.cables).toHaveLength(0);
    store.undo();
    expect(store.plan?.cables.map((c) => c.id)).toEqual(['c-ksu', 'c-front', 'c-back']);
  });

  it('will not take away a station port that has a cable in it', () => {
    const store = benchWith();
    // The fixture cables the adapter into station port 1 of a four-port KSU.
    expect(store.setPortCount(0).ok).toBe(false);
    expect(store.setPortCount(2)).toEqual({ ok: true });
    expect(store.plan?.ksu.ports).toBe(2);
    store.removePart('c-front');
    expect(store.connect({ part: 'front', port: 'cord' }, { part: 'ksu', port: 'port-2' })).toEqual({
      ok: true,
    });
    const refused = store.setPortCount(1);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.reason).toContain('port 2');
    expect(store.plan?.ksu.ports).toBe(2);
  });

  it('keeps the key service unit', () => {
    const store = benchWith();
    const result = store.removePart('ksu');
    expect(result.ok).toBe(false);
    expect(store.plan?.ksu.id).toBe('ksu');
  });

  it('keeps who is off hook across a lead change but restarts when a set comes or goes', () => {
    const store = benchWith();
    store.operate({ kind: 'lift-handset', set: 'front' });
    store.liftLead('back', 18);
    expect(store.evaluation?.sets.find((s) => s.set === 'front')?.offHook).toBe(true);
    store.addSet('six-key', { x: 0, y: 600 });
    expect(store.evaluation?.sets.find((s) => s.set === 'front')?.offHook).toBe(false);
  });
});

describe('bench store evaluation', () => {
  it('keeps a document handed over as reactive state bare, so evaluations do not walk proxies', () => {
    const plan = twoSetPlan();
    // A query's cached answer reaches the page as a deep read-only proxy.
    const store = benchWith(readonly(reactive(plan)) as typeof plan);
    expect(isProxy(store.plan)).toBe(false);
    expect(store.plan).toBe(plan);
  });

  it("keeps a set's observation and the findings while they do not change, and replaces what does", () => {
    const store = benchWith();
    const back = store.setObservations.get('back');
    const front = store.setObservations.get('front');
    const findings = store.findings;
    // A line key latched on the front set while on hook seizes nothing the back set sees (common practice,
    // no published source).
    store.operate({ kind: 'press-key', set: 'front', key: 2 });
    expect(store.setObservations.get('back')).toBe(back);
    expect(store.setObservations.get('front')).not.toBe(front);
    expect(store.setObservations.get('front')?.pressedKey).toBe(2);
    expect(store.findings).toBe(findings);
  });
});
