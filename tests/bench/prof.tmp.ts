import { evaluate } from '/work/main/shared/engine/index';
import { largePlan, busyState } from '/work/main/tests/bench/bench-plans';
const p = largePlan(10); const s = busyState(p);
console.log('findings', evaluate(p, s).findings.length);
for (let k = 0; k < 3; k++) { let t = performance.now(); for (let i = 0; i < 50; i++) evaluate(p, s); console.log('paths', (performance.now() - t) / 50);
t = performance.now(); for (let i = 0; i < 50; i++) evaluate(p, s, { paths: false }); console.log('nopaths', (performance.now() - t) / 50); }
