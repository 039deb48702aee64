import { planBuilder } from '../support/plan-builder';
import { sweep } from '../../shared/engine/search/sweep';
const b = planBuilder();
const ksu = b.ksu({ lines: 5, stations: 2 });
const a = b.set('six-key-hf', 'Front', { station: ksu.stations[0] });
const w = b.set('six-key-hf', 'Work', { station: ksu.stations[1] });
const ad = b.adapter();
const hf = b.addOn(a, 'HF');
b.cable(ksu.port(1), ad.plug); b.cable(ad.jack(1), hf.cord); b.cable(hf.jack, a.cord); b.cable(ad.jack(2), w.cord);
const plan = b.build();
for (let i = 0; i < 5; i++) { const t = performance.now(); sweep(plan); console.log(performance.now() - t); }
