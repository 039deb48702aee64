import { describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { PlanSchema, applyCure, cure, sweep } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import { useBenchStore } from '@/stores/bench.store';
import { viewerReason } from '@/composables/bench/use-bench-plan';

const REASON = viewerReason('Test restorer');

/** The demo plan opened the way a person it is shared with opens it. */
function viewerBench() {
  setActivePinia(createPinia());
  const store = useBenchStore();
  store.load('shared-plan', PlanSchema.parse(demo), {
    updatedAt: '2026-02-01T10:00:00.000Z',
    readOnly: REASON,
  });
  return store;
}

describe('the Bench store with a plan opened to view', () => {
  it('operates the sets: a line key and the handset light that line', () => {
    const store = viewerBench();
    const lineOne = () => store.evaluation?.lines.find((l) => l.line === 1);
    // Idle line, nobody on it: lamp dark (the line lamp follows the line circuit; common practice, no published source).
    expect(lineOne()?.lamp).toBe('dark');
    store.operate({ kind: 'press-key', set: 'front-counter', key: 1 });
    store.operate({ kind: 'lift-handset', set: 'front-counter' });
    expect(store.sim?.sets['front-counter']?.offHook).toBe(true);
    // A line picked up on a set: lamp steady on every set that shows it (common practice, no published source).
    expect(lineOne()?.lamp).toBe('steady');
    expect(store.readOnly).toBe(true);
  });

  it('sweeps and finds the cure, but refuses to apply it, with the reason', () => {
    const store = viewerBench();
    const before = store.plan!;
    expect(sweep(before).findings.length).toBeGreaterThan(0);
    const found = cure(before);
    expect(found.ok).toBe(true);
    expect(store.applyCure(found, applyCure)).toEqual({ ok: false, reason: REASON });
    expect(store.plan).toBe(before);
    expect(store.revision).toBe(0);
  });

  it('refuses every edit and records no history', () => {
    const store = viewerBench();
    const before = store.plan!;
    expect(store.addSet('six-key', { x: 400, y: 400 })).toBeNull();
    expect(store.addAdapter('bridging-adapter', { x: 400, y: 400 })).toBeNull();
    expect(store.removePart('workroom')).toEqual({ ok: false, reason: REASON });
    expect(store.duplicatePart('workroom')).toEqual({ ok: false, reason: REASON });
    expect(store.renamePart('workroom', 'Back office')).toEqual({ ok: false, reason: REASON });
    expect(store.movePart('workroom', { x: 900, y: 900 })).toEqual({ ok: false, reason: REASON });
    expect(store.liftLead('workroom', 18)).toEqual({ ok: false, reason: REASON });
    expect(store.setLineCount(3)).toEqual({ ok: false, reason: REASON });
    store.commit('Replace the drawing', { ...before, name: 'Something else' });
    expect(store.plan).toBe(before);
    expect(store.revision).toBe(0);
    expect(store.past).toHaveLength(0);
    expect(store.canUndo).toBe(false);
    expect(store.unsaved).toBe(false);
  });

  it('becomes editable again when the user’s own copy opens', () => {
    const store = viewerBench();
    store.open('own-copy', PlanSchema.parse(demo), { updatedAt: '2026-02-01T10:05:00.000Z' });
    expect(store.readOnly).toBe(false);
    expect(store.renamePart('workroom', 'Back office')).toEqual({ ok: true });
    expect(store.unsaved).toBe(true);
  });
});
