/**
 * Canvas node and edge kinds of the Bench and how a plan document becomes them.
 * Node data carries only the part id: node components read the part, its template and its live
 * observation from the bench store, so the flow graph changes only when parts, positions or cables do.
 */
import type { Edge, Node } from '@vue-flow/core';
import { getTemplate, ksuPortName, type Plan } from '@shared/engine';

export interface PartData {
  partId: string;
}
export type SetData = PartData;
export type KsuData = PartData;
export type AdapterData = PartData;
export type AddOnData = PartData;
export interface CableData {
  cableId: string;
}

/* eslint-disable @typescript-eslint/no-explicit-any -- vue-flow's custom-event slot is unused here */
export type SetFlowNode = Node<SetData, any, 'set'>;
export type KsuFlowNode = Node<KsuData, any, 'ksu'>;
export type AdapterFlowNode = Node<AdapterData, any, 'adapter'>;
export type AddOnFlowNode = Node<AddOnData, any, 'add-on'>;
export type CableFlowEdge = Edge<CableData, any, 'cable'>;
/* eslint-enable @typescript-eslint/no-explicit-any */

export type BenchFlowNode = SetFlowNode | KsuFlowNode | AdapterFlowNode | AddOnFlowNode;

export interface PortView {
  name: string;
  gender: 'plug' | 'jack';
  label: string;
}

/** The 25-pair ports a part offers, as handles on its node. */
export function portsOf(plan: Plan, partId: string): PortView[] {
  if (plan.ksu.id === partId) {
    return Array.from({ length: plan.ksu.ports }, (_, i) => ({
      name: ksuPortName(i + 1),
      gender: 'jack' as const,
      label: `Port ${i + 1}`,
    }));
  }
  const part =
    plan.sets.find((s) => s.id === partId) ??
    plan.addOns.find((a) => a.id === partId) ??
    plan.adapters.find((a) => a.id === partId);
  const template = part ? getTemplate(part.template) : undefined;
  return template ? template.ports.map((p) => ({ name: p.name, gender: p.gender, label: p.label })) : [];
}

/** Human label of a port name, e.g. `port-2` → "Port 2", `line-cord` → "Line cord". */
export function portLabel(name: string): string {
  const words = name.replace(/[-_]+/g, ' ').trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

const DEFAULT_X = 80;
const DEFAULT_Y = 80;

/** Parts without a saved position are laid out in a simple grid until the user moves them. */
function placed(pos: { x: number; y: number } | undefined, index: number, column: number) {
  return pos ?? { x: DEFAULT_X + column * 320, y: DEFAULT_Y + index * 260 };
}

/**
 * The part frame inside each node is the drawing's roving tab stop (canvas-view.ts), so vue-flow's own
 * wrapper stays out of the tab order.
 */
export function planToNodes(plan: Plan): BenchFlowNode[] {
  return partNodes(plan).map((n) => ({ ...n, focusable: false }));
}

function partNodes(plan: Plan): BenchFlowNode[] {
  const nodes: BenchFlowNode[] = [
    {
      id: plan.ksu.id,
      type: 'ksu',
      position: placed(plan.ksu.position, 0, 0),
      data: { partId: plan.ksu.id },
    },
  ];
  plan.adapters.forEach((a, i) =>
    nodes.push({ id: a.id, type: 'adapter', position: placed(a.position, i, 1), data: { partId: a.id } }),
  );
  plan.sets.forEach((s, i) =>
    nodes.push({ id: s.id, type: 'set', position: placed(s.position, i, 2), data: { partId: s.id } }),
  );
  plan.addOns.forEach((a, i) =>
    nodes.push({ id: a.id, type: 'add-on', position: placed(a.position, i, 3), data: { partId: a.id } }),
  );
  return nodes;
}

export function planToEdges(plan: Plan): CableFlowEdge[] {
  return plan.cables.map((c) => ({
    id: c.id,
    type: 'cable',
    source: c.from.part,
    sourceHandle: c.from.port,
    target: c.to.part,
    targetHandle: c.to.port,
    data: { cableId: c.id },
  }));
}
