/** Engine answers in the words a restorer reads: parts by their names and stations by code and label, never ids. */
import { listWords, type Plan, type RequiredFailure } from '../engine/index';

const partName = (plan: Plan, id: string) =>
  [...plan.sets, ...plan.addOns, ...plan.adapters].find((p) => p.id === id)?.name ?? id;

function stationName(plan: Plan, id: string): string {
  const st = plan.ksu.stations.find((s) => s.id === id);
  if (!st) return `station ${id}`;
  return `station ${st.code}${st.label ? ` (${st.label})` : ''}`;
}

/** A failing required function in one sentence; the intercom's are rebuilt from the failure's own fields. */
export function requiredFailureWords(plan: Plan, failure: RequiredFailure): string {
  if (failure.function !== 'intercomPerStation') return failure.message;
  const sets = listWords(failure.sets.map((id) => partName(plan, id)));
  const station = failure.stations.map((id) => stationName(plan, id)).join(', ');
  return failure.kind === 'missing'
    ? `A call to ${station} does not buzz ${sets}`
    : `A call to ${station} also buzzes ${sets}`;
}
