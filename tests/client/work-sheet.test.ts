import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { checkRequired, PlanSchema, standardCrossConnect, type LeadChange, type Plan } from '@shared/engine';
import { requiredFailureWords } from '@shared/work-sheet/words';
import { buildWorkSheet } from '@/work-sheet/work-sheet';
import demoPlan from '../../shared/engine/examples/demo-plan.json';
import WorkSheetView from '@/components/work-sheet/WorkSheetView.vue';

/** An invented shop: two hands-free-ready six-key sets on one bridging adapter, a speaker on the front desk. */
function shopPlan(changes: { front?: LeadChange[]; back?: LeadChange[] } = {}): Plan {
  return PlanSchema.parse({
    version: 1,
    name: 'Corner print shop',
    ksu: {
      id: 'ksu',
      name: 'Shop KSU',
      lines: [1, 2, 3, 4, 5].map((n) => ({ number: n, directoryNumber: `555020${n}` })),
      stations: [
        { id: 'st-front', code: '31', label: 'Front desk' },
        { id: 'st-back', code: '32', label: 'Back room' },
      ],
      ports: 2,
    },
    sets: [
      {
        id: 'front',
        name: 'Front desk',
        template: 'six-key-hf',
        station: 'st-front',
        leadChanges: changes.front,
      },
      {
        id: 'back',
        name: 'Back room',
        template: 'six-key-hf',
        station: 'st-back',
        leadChanges: changes.back,
      },
    ],
    addOns: [{ id: 'speaker', name: 'Desk speaker', template: 'hands-free-unit', serves: 'front' }],
    adapters: [{ id: 'bridge', name: 'Bridge', template: 'bridging-adapter' }],
    cables: [
      { id: 'c-ksu', from: { part: 'bridge', port: 'plug' }, to: { part: 'ksu', port: 'port-1' } },
      { id: 'c-speaker', from: { part: 'speaker', port: 'cord' }, to: { part: 'bridge', port: 'jack-1' } },
      { id: 'c-front', from: { part: 'front', port: 'cord' }, to: { part: 'speaker', port: 'set' } },
      { id: 'c-back', from: { part: 'back', port: 'cord' }, to: { part: 'bridge', port: 'jack-2' } },
    ],
  });
}

const PRINTED = new Date('2026-03-14T09:00:00Z');

function mountSheet(plan: Plan) {
  return mount(WorkSheetView, { props: { plan, printedAt: PRINTED } });
}

describe('WorkSheetView', () => {
  const plan = shopPlan({
    front: [{ kind: 'lift', pair: 24, conductor: 'both' }],
    back: [
      { kind: 'lift', pair: 23, conductor: 'both' },
      { kind: 'lift', pair: 25, conductor: 'tip' },
      { kind: 'move', pair: 18, toPair: 17 },
    ],
  });

  it('numbers every lead change across the parts, in the order of the plan', () => {
    const wrapper = mountSheet(plan);

    const steps = wrapper.findAll('[data-testid^="sheet-step-"]').map((r) => r.attributes('data-testid'));
    // Four lead changes in the plan above, sets first, each part's changes in document order.
    expect(steps).toEqual(['sheet-step-1', 'sheet-step-2', 'sheet-step-3', 'sheet-step-4']);
    const headings = wrapper.findAll('h2').map((h) => h.text());
    expect(headings.slice(0, 2)).toEqual(['Front desk', 'Back room']);
    expect(wrapper.get('[data-testid="sheet-counts"]').text()).toBe('2 sets, 1 add-on');
  });

  it('prints the pair colour names, designations and connector pins of each change', () => {
    const wrapper = mountSheet(plan);

    const front = wrapper.get('[data-testid="sheet-step-1"]').text();
    // Pair 24 is violet-brown (ICEA S-80-576: 5th tip colour violet, 4th ring colour brown).
    expect(front).toContain('violet-brown');
    // Tip of pair n on pin n+25, ring on pin n (USOC RJ21X, 47 CFR Part 68 Subpart F).
    expect(front).toContain('tip, violet, pin 49');
    expect(front).toContain('ring, brown, pin 24');
    // MU/MR are our template's mute-lead designations (shared/engine/templates/part-templates.ts).
    expect(front).toContain('MU');
    expect(front).toContain('MR');
    expect(front).toContain('Lift both leads of pair 24 (violet-brown)');

    const tipOnly = wrapper.get('[data-testid="sheet-step-3"]').text();
    // Pair 25 is violet-slate (ICEA S-80-576); its tip lands on pin 50 (RJ21X).
    expect(tipOnly).toContain('violet-slate');
    expect(tipOnly).toContain('Lift the tip lead of pair 25 (violet-slate)');
    expect(tipOnly).toContain('cord pin 50');
    expect(tipOnly).toContain('Leave the ring lead on.');
    expect(tipOnly).not.toContain('pin 25)');

    const move = wrapper.get('[data-testid="sheet-step-4"]').text();
    // Pair 18 is yellow-green and pair 17 yellow-orange (ICEA S-80-576: 4th tip colour yellow).
    expect(move).toContain('Re-terminate pair 18 (yellow-green) leads on spare pair 17 (yellow-orange)');
    // Yellow tip of pair 18 on pin 43 moves to the yellow tip of pair 17 on pin 42 (RJ21X).
    expect(move).toContain('take off the yellow tip (pin 43) and land the yellow tip of pair 17 (pin 42)');
  });

  it('states what lifting a private lead costs, depending on whether the set has its add-on', () => {
    const wrapper = mountSheet(plan);
    const costs = wrapper.findAll('[data-testid="sheet-cost"]').map((c) => c.text());

    // Pairs 23–25 are the private hands-free leads of the wired-for-hands-free set (templates/README.md).
    expect(costs[0]).toBe('Front desk loses its hands-free connection.');
    // Nothing is lost today, but the set could not take an add-on later: said apart, never "none" and a loss at once.
    expect(costs[1]).toBe(
      'Nothing stops working today (Back room has no hands-free add-on), but Back room could not take one later without putting the leads back.',
    );
    expect(costs[3]).toContain('None once the KSU feeds pair 17');
  });

  const withBuzzer = (station: string, to: { port: number; pair: number }): Plan => {
    const crossConnect = standardCrossConnect(plan.ksu).map((x) =>
      x.lead.kind === 'buzzer' && x.lead.station === station ? { ...x, ...to } : x,
    );
    return { ...plan, ksu: { ...plan.ksu, crossConnect } };
  };
  const crossRows = (p: Plan) =>
    mountSheet(p)
      .findAll('table[aria-label="KSU cross-connect changes"] tbody tr')
      .map((r) => r.text());

  it('makes the cross-connect change a cure needs: the back room buzzer follows its set to pair 17', () => {
    // Back room moves its buzzer pair 18 to spare pair 17, so station 32's buzzer output must land there too.
    const rows = crossRows(withBuzzer('st-back', { port: 1, pair: 17 }));
    expect(rows).toHaveLength(1);
    expect(rows[0]).toContain(
      'Connect the buzzer output of intercom station 32 to port 1, pair 17 (yellow-orange).',
    );
    // Pins of pair 17 on the port's connector: tip 42, ring 17 (RJ21X).
    expect(rows[0]).toContain('pins 42 (T), 17 (R)');
  });

  it('puts back a cross-connect entry that is itself the fault, never telling to wire the fault', () => {
    // Station 31's buzzer on pair 17 reaches Back room (moved there) instead of Front desk: wired wrong.
    const rows = crossRows(withBuzzer('st-front', { port: 1, pair: 17 }));
    expect(rows.join('\n')).not.toContain(
      'Connect the buzzer output of intercom station 31 to port 1, pair 17',
    );
    expect(rows.join('\n')).toContain(
      'Take the buzzer output of intercom station 31 off port 1, pair 17 (yellow-orange).',
    );
  });

  it('on the demo plan lists no step that would make its fault, and names parts, not ids', () => {
    const demo = PlanSchema.parse(demoPlan);
    const sheet = buildWorkSheet(demo);
    // Both sets bridge on port 1, so station 22's extra buzzer feed on pair 18 changes which set is wrong,
    // not whether one is: no step, only a note to leave it as wired.
    expect(sheet.crossConnect).toEqual([]);
    expect(sheet.crossConnectKept.map((k) => `${k.port}/${k.pair}`)).toEqual(['1/18']);
    const words = checkRequired(demo).map((f) => requiredFailureWords(demo, f));
    expect(words).toContain('A call to station 22 (Workroom) also buzzes Front counter');
    expect(words.join(' ')).not.toMatch(/front-counter|workroom\b/);
  });

  it('lists what to test by hand: every set on its lines, and each intercom station', () => {
    const wrapper = mountSheet(plan);
    const checks = wrapper.findAll('[data-testid="sheet-hand-check"]').map((r) => r.text());

    // Two sets with five lines each, two stations; plan.required defaults keep all lines and the intercom.
    expect(checks).toHaveLength(4);
    expect(checks[0]).toContain('On line 1, 2, 3, 4 and 5');
    expect(checks[2]).toContain('Dial 31 on the intercom: Front desk buzzes');
  });

  it('shows the empty state when the plan has no lead changes', () => {
    const wrapper = mountSheet(shopPlan());

    expect(wrapper.get('[data-testid="sheet-empty"]').text()).toContain(
      'No lead changes in this plan yet — find a cure on the Bench.',
    );
    expect(wrapper.findAll('table')).toHaveLength(0);
    expect(wrapper.get('[data-testid="sheet-steps-total"]').text()).toBe('0');
    expect(wrapper.get('[data-testid="safety-notice"]').text()).toContain('48–52 V DC');
  });
});
