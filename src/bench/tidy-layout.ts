/**
 * Tidy: the installation laid out left to right with ELK's layered algorithm, the KSU first, then adapters,
 * add-ons and sets in cable order. Every 25-pair port is an ELK port at the same spot as its handle on the
 * canvas (plugs on the left edge, jacks on the right), so the orthogonal cable routes ELK returns start and end
 * where the drawn cables do. Pure: a plan and part sizes in, positions and routes out; the ELK engine is passed
 * in so the page can load it lazily and the tests can use it directly.
 */
import type { ElkExtendedEdge, ElkNode } from 'elkjs/lib/elk-api';
import { getTemplate, ksuPortName, type Plan } from '@shared/engine';
import { DEFAULT_PART_SIZE, type Point, type Size } from './placement';

/** The part of ELK's API this needs (`new ELK()` from `elkjs/lib/elk.bundled.js` has it). */
export interface ElkEngine {
  layout(graph: ElkNode): Promise<ElkNode>;
}

export interface TidyLayout {
  positions: { id: string; position: Point }[];
  /** Orthogonal route of each cable, from its plug end to its jack end, in drawing coordinates. */
  routes: Record<string, Point[]>;
}

const LAYOUT_OPTIONS = {
  'elk.algorithm': 'layered',
  'elk.direction': 'RIGHT',
  'elk.edgeRouting': 'ORTHOGONAL',
  'elk.spacing.nodeNode': '60',
  'elk.layered.spacing.nodeNodeBetweenLayers': '140',
  'elk.spacing.edgeNode': '30',
  'elk.layered.considerModelOrder.strategy': 'NODES_AND_EDGES',
};

interface PortSpec {
  name: string;
  gender: 'plug' | 'jack';
}

function portsOf(plan: Plan, partId: string): PortSpec[] {
  if (partId === plan.ksu.id)
    return Array.from({ length: plan.ksu.ports }, (_, i) => ({ name: ksuPortName(i + 1), gender: 'jack' }));
  const part = [...plan.sets, ...plan.addOns, ...plan.adapters].find((p) => p.id === partId);
  return getTemplate(part?.template ?? '')?.ports ?? [];
}

const portId = (part: string, port: string) => `${part}\u0000${port}`;

/** The parts of a plan in drawing order: KSU, adapters, add-ons, sets. */
export function partOrder(plan: Plan): { id: string; position?: Point }[] {
  return [plan.ksu, ...plan.adapters, ...plan.addOns, ...plan.sets];
}

/** Ports spaced along the node's edge as the canvas's handles are: the i-th of n at (i + 1) / (n + 1). */
function elkNode(plan: Plan, id: string, size: Size): ElkNode {
  const ports = portsOf(plan, id);
  const side = (gender: PortSpec['gender']) => ports.filter((p) => p.gender === gender);
  return {
    id,
    width: size.width,
    height: size.height,
    layoutOptions: { 'elk.portConstraints': 'FIXED_POS' },
    ports: (['plug', 'jack'] as const).flatMap((gender) =>
      side(gender).map((p, i, all) => ({
        id: portId(id, p.name),
        x: gender === 'plug' ? 0 : size.width,
        y: ((i + 1) / (all.length + 1)) * size.height,
        width: 0,
        height: 0,
        layoutOptions: { 'elk.port.side': gender === 'plug' ? 'WEST' : 'EAST' },
      })),
    ),
  };
}

export async function tidyLayout(
  elk: ElkEngine,
  plan: Plan,
  sizeOf: (id: string) => Size | undefined,
): Promise<TidyLayout> {
  const parts = partOrder(plan);
  const sizes = new Map(parts.map((p) => [p.id, sizeOf(p.id) ?? DEFAULT_PART_SIZE]));
  // Jack to plug, so cables run left to right from the KSU towards the sets.
  const edges: ElkExtendedEdge[] = plan.cables.map((c) => ({
    id: c.id,
    sources: [portId(c.to.part, c.to.port)],
    targets: [portId(c.from.part, c.from.port)],
  }));
  const graph = await elk.layout({
    id: 'plan',
    layoutOptions: LAYOUT_OPTIONS,
    children: parts.map((p) => elkNode(plan, p.id, sizes.get(p.id) ?? DEFAULT_PART_SIZE)),
    edges,
  });

  // Keep the drawing where it was: the laid-out box starts at the old box's top-left corner.
  const placed = new Map((graph.children ?? []).map((n) => [n.id, { x: n.x ?? 0, y: n.y ?? 0 }]));
  const known = parts.flatMap((p) => (p.position ? [p.position] : []));
  const corner = (axis: 'x' | 'y') => (known.length ? Math.round(Math.min(...known.map((p) => p[axis]))) : 0);
  const laid = [...placed.values()];
  const from = (axis: 'x' | 'y') => Math.min(...laid.map((p) => p[axis]));
  const dx = corner('x') - from('x');
  const dy = corner('y') - from('y');
  const shift = (p: Point) => ({ x: Math.round(p.x + dx), y: Math.round(p.y + dy) });

  const routes: Record<string, Point[]> = {};
  for (const edge of (graph.edges ?? []) as ElkExtendedEdge[]) {
    const section = edge.sections?.[0];
    if (!section) continue;
    routes[edge.id] = [section.startPoint, ...(section.bendPoints ?? []), section.endPoint]
      .map(shift)
      .reverse();
  }
  return {
    positions: parts.map((p) => ({ id: p.id, position: shift(placed.get(p.id) ?? { x: 0, y: 0 }) })),
    routes,
  };
}
