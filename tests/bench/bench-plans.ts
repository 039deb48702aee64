/** Plans for the benchmark: the shipped two-set example and generated larger installations. */
import { initialState, type Plan, type SimState } from '../../shared/engine/index';
import { examplePlan } from '../support/example-plans';
import { planBuilder } from '../support/plan-builder';

export { examplePlan };

/** `sets` sets of the given template on one four-jack bridging adapter, on KSU port 1. */
export function setsOnOneAdapter(sets: number, template = 'six-key-hf'): Plan {
  const b = planBuilder(`${sets} sets on one adapter`);
  const ksu = b.ksu({ lines: 5, stations: 2 });
  const ad = b.adapter('bridging-adapter-4');
  b.cable(ksu.port(1), ad.plug);
  for (let i = 1; i <= sets; i++) b.cable(ad.jack(i), b.set(template, `Set ${i}`).cord);
  return b.build();
}

/**
 * A large installation: `adapters` four-jack adapters, each on its own KSU port, four sets on each (templates in
 * turn), a hands-free add-on in front of every fourth set.
 */
export function largePlan(adapters = 10, sets = adapters * 4): Plan {
  const templates = ['six-key', 'six-key-hf', 'ten-key', 'six-key-hf'];
  const b = planBuilder(`${sets} sets on ${adapters} adapters`);
  const ksu = b.ksu({ lines: 9, stations: Math.min(adapters, 40), ports: Math.max(adapters, 1) });
  let n = 0;
  for (let a = 1; a <= adapters; a++) {
    const ad = b.adapter('bridging-adapter-4', `Adapter ${a}`);
    b.cable(ksu.port(a), ad.plug);
    for (let j = 1; j <= 4 && n < sets; j++) {
      n++;
      const set = b.set(templates[(n - 1) % templates.length], `Set ${n}`, { station: ksu.stations[a - 1] });
      if (n % 4 === 0) {
        const addOn = b.addOn(set, `Speaker ${n}`);
        b.cable(set.cord, addOn.jack);
        b.cable(addOn.cord, ad.jack(j));
      } else {
        b.cable(set.cord, ad.jack(j));
      }
    }
  }
  return b.build();
}

/** A busy moment: every third set off-hook on a line key, every fifth with a key latched and the handset down. */
export function busyState(plan: Plan): SimState {
  const state = initialState(plan);
  plan.sets.forEach((set, i) => {
    if (i % 3 === 0) state.sets[set.id] = { offHook: true, pressedKey: (i % 5) + 1, handsFreeOn: false };
    else if (i % 5 === 0)
      state.sets[set.id] = { offHook: false, pressedKey: ((i + 2) % 5) + 1, handsFreeOn: false };
  });
  return state;
}
