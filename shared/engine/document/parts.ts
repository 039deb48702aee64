/** Finding a part of a plan by its id (ids are unique across parts, validatePlan checks it). */
import type { AddOn, Adapter, KeySet, Plan } from './plan.schema';

/** A set or an add-on: the parts that have leads to change. */
export type LeadPart = KeySet | AddOn;

export function findSet(plan: Plan, id: string | undefined): KeySet | undefined {
  return plan.sets.find((s) => s.id === id);
}

export function findAddOn(plan: Plan, id: string | undefined): AddOn | undefined {
  return plan.addOns.find((a) => a.id === id);
}

/** The set or add-on with this id. */
export function findLeadPart(plan: Plan, id: string | undefined): LeadPart | undefined {
  return findSet(plan, id) ?? findAddOn(plan, id);
}

/** Any set, add-on or adapter with this id (the KSU is plan.ksu). */
export function findPart(plan: Plan, id: string | undefined): KeySet | AddOn | Adapter | undefined {
  return findLeadPart(plan, id) ?? plan.adapters.find((a) => a.id === id);
}

/** The name of the set the add-on serves, or the id it names when there is no such set. */
export function servedName(plan: Plan, addOn: AddOn): string {
  return findSet(plan, addOn.serves)?.name ?? addOn.serves;
}
