import { planBuilder } from '../support/plan-builder';
import { buildNetlist } from '../../shared/engine/model/netlist';
const b = planBuilder();
const ksu = b.ksu({ lines: 5, stations: 2 });
const a = b.set('six-key-hf', 'Front', { station: ksu.stations[0] });
const w = b.set('six-key-hf', 'Work', { station: ksu.stations[1] });
const ad = b.adapter();
const hf = b.addOn(a, 'HF');
b.cable(ksu.port(1), ad.plug); b.cable(ad.jack(1), hf.cord); b.cable(hf.jack, a.cord); b.cable(ad.jack(2), w.cord);
const plan = b.build();
for (let k = 0; k < 3; k++) { const t = performance.now(); for (let i = 0; i < 200; i++) buildNetlist(plan); console.log('buildNetlist', (performance.now() - t) / 200); }
const t = performance.now(); for (let i = 0; i < 2000; i++) structuredClone(plan); console.log('clone', (performance.now() - t) / 2000);
