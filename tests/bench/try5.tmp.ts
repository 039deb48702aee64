import { planBuilder } from '../support/plan-builder';
import * as S from '../../shared/engine/search/sweep';
import { cure } from '../../shared/engine/search/cure';
import * as R from '../../shared/engine/search/required';
const b = planBuilder();
const ksu = b.ksu({ lines: 5, stations: 2 });
const a = b.set('six-key-hf', 'Front', { station: ksu.stations[0] });
const w = b.set('six-key-hf', 'Work', { station: ksu.stations[1] });
const ad = b.adapter();
const hf = b.addOn(a, 'HF');
b.cable(ksu.port(1), ad.plug); b.cable(ad.jack(1), hf.cord); b.cable(hf.jack, a.cord); b.cable(ad.jack(2), w.cord);
const plan = b.build();
for (let i = 0; i < 4; i++) { let t = performance.now(); const c = cure(plan); console.log('cure', performance.now() - t, c.searched); }
let t = performance.now(); for (let i = 0; i < 20; i++) R.checkRequired(plan); console.log('checkRequired', (performance.now() - t) / 20);
t = performance.now(); for (let i = 0; i < 5; i++) S.sweep(plan); console.log('sweep', (performance.now() - t) / 5);
