import { cureOptimal, cure, sweep, applyCure, checkRequired } from '../../shared/engine/index';
import { examplePlan, largePlan, setsOnOneAdapter } from './bench-plans';
async function main() {
  for (const [name, plan] of [
    ['demo', examplePlan('demo-plan.json')],
    ['two-set', examplePlan('two-set.json')],
    ['intercom', examplePlan('intercom.json')],
    ['six-and-ten', examplePlan('six-and-ten.json')],
    ['4 on adapter', setsOnOneAdapter(4)],
    ['large 1', largePlan(1)],
    ['large 10', largePlan(10)],
  ] as const) {
    const t = performance.now();
    const r = await cureOptimal(plan);
    const dt = performance.now() - t;
    const cured = r.ok ? applyCure(plan, r) : plan;
    const sw = sweep(cured);
    console.log(name, r.ok, r.changes.length, r.weight, r.rounds, r.verifiedBy, dt.toFixed(0), 'ms; after', sw.findings.length, sw.complete, checkRequired(cured).length, r.message.slice(0, 150));
  }
}
main();
