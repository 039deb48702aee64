/** Plans the cure tests share. */
import { validatePlan, type Plan } from '../../shared/engine/index';

/** The plan with a hands-free add-on serving each set (not cabled: only its presence matters to the cost). */
export function withAddOnForEverySet(plan: Plan): Plan {
  const addOns = plan.sets.map((s, i) => ({
    id: `hf-${i}`,
    name: `Speaker ${i}`,
    template: 'hands-free-unit',
    serves: s.id,
    leadChanges: [],
  }));
  const r = validatePlan({ ...plan, addOns });
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.plan;
}
