/** Whether a cable may join two ports on the canvas, with the reason in plain words when not. */
import type { Plan, PortRef } from '../document/plan.schema';
import { portsOf } from './validate-plan';

export type CanConnectResult = { ok: true } | { ok: false; reason: string };

export function canConnect(plan: Plan, from: PortRef, to: PortRef): CanConnectResult {
  const parts = portsOf(plan);
  const ends = [from, to].map((ref) => {
    const part = parts.get(ref.part);
    return { ref, part, port: part?.ports.get(ref.port) };
  });
  for (const e of ends) {
    if (!e.part) return { ok: false, reason: `There is no part "${e.ref.part}" in this plan.` };
    if (!e.port) return { ok: false, reason: `${e.part.name} has no port "${e.ref.port}".` };
  }
  const [a, b] = ends;
  if (from.part === to.part) return { ok: false, reason: `${a.part!.name} cannot be cabled to itself.` };
  if (a.port!.gender === b.port!.gender) {
    const g = a.port!.gender;
    return { ok: false, reason: `Both ends are ${g}s: a cable joins a plug to a jack.` };
  }
  for (const e of ends) {
    const cable = plan.cables.find(
      (c) =>
        (c.from.part === e.ref.part && c.from.port === e.ref.port) ||
        (c.to.part === e.ref.part && c.to.port === e.ref.port),
    );
    if (cable)
      return {
        ok: false,
        reason: `${e.part!.name}'s ${e.ref.port} is already used by cable ${cable.label || cable.id}.`,
      };
  }
  return { ok: true };
}
