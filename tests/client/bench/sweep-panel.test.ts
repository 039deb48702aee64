import { describe, expect, it } from 'vitest';
import { nextTick } from 'vue';
import { PlanSchema } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import SweepPanel from '@/components/bench/SweepPanel.vue';
import { benchWith } from './bench-fixture';
import { untilIdle, workerHost } from './worker-host';

const host = () => workerHost(SweepPanel);

/** Twelve six-key sets on three four-jack adapters, one per KSU port, each port's sets answering its station. */
function twelveSetsOnThreePorts() {
  const stations = [21, 22, 23].map((code) => ({ id: `st-${code}`, code: String(code), label: '' }));
  const plan = {
    version: 1,
    name: 'Twelve sets',
    description: '',
    ksu: {
      id: 'ksu',
      name: 'KSU',
      lines: [1, 2, 3, 4, 5].map((n) => ({ number: n, label: '', directoryNumber: `555010${n}` })),
      stations,
      ports: 3,
      position: { x: 0, y: 0 },
    },
    sets: [] as object[],
    addOns: [],
    adapters: [] as object[],
    cables: [] as object[],
    required: { allLinesOnEverySet: true, intercomPerStation: true, handsFreeSets: [] },
  };
  for (let a = 1; a <= 3; a++) {
    plan.adapters.push({
      id: `adapter-${a}`,
      name: `Adapter ${a}`,
      template: 'bridging-adapter-4',
      position: { x: 250, y: a * 200 },
    });
    plan.cables.push({
      id: `k${a}`,
      from: { part: 'ksu', port: `port-${a}` },
      to: { part: `adapter-${a}`, port: 'plug' },
    });
    for (let j = 1; j <= 4; j++) {
      const id = `set-${a}${j}`;
      plan.sets.push({
        id,
        name: `Set ${a}${j}`,
        template: 'six-key',
        station: stations[a - 1].id,
        ringerLines: [],
        leadChanges: [],
        position: { x: 500, y: a * 200 + j * 40 },
      });
      plan.cables.push({
        id: `c${a}${j}`,
        from: { part: `adapter-${a}`, port: `jack-${j}` },
        to: { part: id, port: 'cord' },
      });
    }
  }
  return PlanSchema.parse(plan);
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 5));

describe('SweepPanel', () => {
  it('runs the sweep off the page and puts the canvas into a reproducing state', async () => {
    const store = benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    expect(t.worker.running.value).toBe('sweep');
    await settle();
    await nextTick();
    const expected = t.worker.sweepResult.value!;
    expect(expected.findings.length).toBeGreaterThan(0);
    expect(t.wrapper.get('[data-testid="sweep-summary"]').text()).toContain(
      `${expected.statesVisited.toLocaleString('en')} states visited`,
    );
    const rows = t.wrapper.findAll('[data-testid^="sweep-row-"]');
    expect(rows).toHaveLength(expected.findings.length);

    const last = expected.findings.length - 1;
    await t.wrapper.get(`[data-testid="sweep-show-${last}"]`).trigger('click');
    expect(store.sim).toEqual(expected.findings[last].state);
    expect(store.selectedFinding?.code).toBe(expected.findings[last].finding.code);
    // The reproducing state really shows the fault on the canvas.
    expect(store.findings.map((f) => f.code)).toContain(expected.findings[last].finding.code);
  }, 30_000);

  it('shows one kind of finding at a time and keeps each row reproducible', async () => {
    benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await settle();
    await nextTick();
    const all = t.worker.sweepResult.value!.findings;
    // The demo plan joins lines and shares a buzzer pair (common practice, no published source), so the
    // sweep finds more than one kind.
    const joined = all.filter((row) => row.finding.code === 'LINES_JOINED');
    expect(joined.length).toBeGreaterThan(0);
    expect(joined.length).toBeLessThan(all.length);

    await t.wrapper.get('[data-testid="sweep-kind-LINES_JOINED"]').trigger('click');
    const rows = t.wrapper.findAll('[data-testid^="sweep-row-"]');
    expect(rows).toHaveLength(joined.length);
    expect(rows.every((r) => r.attributes('data-testid') === 'sweep-row-LINES_JOINED')).toBe(true);
    // Row buttons keep the finding's place in the whole result.
    const first = all.findIndex((row) => row.finding.code === 'LINES_JOINED');
    expect(rows[0].find(`[data-testid="sweep-show-${first}"]`).exists()).toBe(true);
  }, 30_000);

  it('cancel stops the worker and ignores its late answer', async () => {
    benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await t.wrapper.get('[data-testid="sweep-cancel"]').trigger('click');
    expect(t.made[0].terminated).toBe(true);
    await settle();
    expect(t.worker.running.value).toBeNull();
    expect(t.worker.sweepResult.value).toBeNull();
  });

  it('says plainly that a sweep of every state is complete', async () => {
    benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await untilIdle(t.worker);
    await nextTick();
    // Two six-key sets, one with an add-on: 12 × 24 position combinations times a few dozen KSU events at most,
    // far under the sound sweep's 4 000 000 (shared/engine/search/README.md, "Sweep"), so every state is visited.
    expect(t.worker.sweepResult.value!.complete).toBe(true);
    const text = t.wrapper.get('[data-testid="sweep-complete"]').text();
    expect(text).toMatch(/^Complete: every reachable state was covered/);
    expect(text).not.toContain('Not complete');
  }, 30_000);

  it('says when the sweep is not complete and why', async () => {
    benchWith(PlanSchema.parse(demo));
    const t = workerHost(SweepPanel, { limit: 50 });
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await untilIdle(t.worker);
    await nextTick();
    const result = t.worker.sweepResult.value!;
    // 50 states is far fewer than the plan has (see above), so the sweep stops short.
    expect(result.complete).toBe(false);
    expect(result.statesVisited).toBeLessThanOrEqual(50);
    const text = t.wrapper.get('[data-testid="sweep-complete"]').text();
    expect(text).toContain('Not complete:');
    expect(text).toContain(result.incompleteReason!);
    expect(text).not.toMatch(/^Complete/);
  }, 30_000);

  it('says a sweep too large to visit is complete by proof, not how many states it visited', async () => {
    // Twelve six-key sets, four on each of three ports, each port's sets answering that port's station: 12^12
    // position combinations is far over the sound sweep's 4 000 000 states (shared/engine/search/README.md,
    // "Sweep"), and nothing in it joins lines or buzzes the wrong sets, so the clean proof holds.
    benchWith(twelveSetsOnThreePorts());
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await untilIdle(t.worker);
    await nextTick();
    const result = t.worker.sweepResult.value!;
    expect(result.complete).toBe(true);
    expect(result.cleanProof).toBeTruthy();
    const summary = t.wrapper.get('[data-testid="sweep-summary"]').text();
    expect(summary).toContain('checked by proof');
    expect(summary).not.toContain('states visited');
    const coverage = t.wrapper.get('[data-testid="sweep-complete"]').text();
    expect(coverage).toContain(result.cleanProof!);
    expect(coverage).not.toContain('Not complete');
  }, 30_000);
});
