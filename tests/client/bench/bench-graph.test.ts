import { describe, expect, it } from 'vitest';
import { defineComponent, h } from 'vue';
import { mount } from '@vue/test-utils';
import { PlanSchema, type Hop } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import { useBenchGraph } from '@/composables/bench/use-bench-graph';
import { pathSentence, pathStrip } from '@/bench/finding-path';
import { benchWith } from './bench-fixture';

function graphOf() {
  let graph!: ReturnType<typeof useBenchGraph>;
  mount(
    defineComponent({
      setup() {
        graph = useBenchGraph();
        return () => h('div');
      },
    }),
  );
  return graph;
}

describe('use-bench-graph', () => {
  it('lights only the cables and parts on the chosen finding’s hops and fades the rest', () => {
    const store = benchWith(PlanSchema.parse(demo));
    const graph = graphOf();
    expect(graph.edges.value.every((e) => !e.data.lit && !e.data.dimmed)).toBe(true);
    expect(graph.nodes.value.every((n) => n.class === undefined)).toBe(true);

    // The demo's private-lead warning runs set → speaker → adapter → set, never over the station cable to the KSU.
    const finding = store.findings.find(
      (f) => f.code === 'PRIVATE_LEAD_SHARED' && f.sets.includes('front-counter'),
    );
    expect(finding).toBeDefined();
    store.selectFinding(finding!);
    const lit = graph.edges.value.filter((e) => e.data.lit).map((e) => e.id);
    const dimmed = graph.edges.value.filter((e) => e.data.dimmed).map((e) => e.id);
    expect(lit.sort()).toEqual(['counter-cord', 'speaker-cord', 'workroom-cord']);
    expect(dimmed).toEqual(['station-cable']);
    expect(graph.nodes.value.filter((n) => n.class === 'lb-dimmed').map((n) => n.id)).toEqual(['ksu']);
    // Pair 23 tip carries the set's talk lead CT (our own six-key hands-free template).
    expect(graph.edges.value.find((e) => e.id === 'counter-cord')?.data.pairs).toEqual(['pair 23 tip']);

    store.selectFinding(null);
    expect(graph.edges.value.some((e) => e.data.dimmed)).toBe(false);
  });
});

describe('finding path in words', () => {
  const hop = (part: string, pair?: number, conductor?: 'tip' | 'ring'): Hop => ({
    part,
    partName: part.toUpperCase(),
    pair,
    conductor,
    text: part,
  });

  it('names a pair again only where a moved lead changes it', () => {
    // Pair 2 is white-orange and pair 7 red-orange (ICEA S-80-576 colour code).
    const strip = pathStrip([
      hop('a', 2, 'ring'),
      hop('a', 2, 'ring'),
      hop('b', 2, 'ring'),
      hop('c', 7, 'ring'),
    ]);
    expect(strip.map((s) => (s.kind === 'part' ? s.name : `${s.pair} ${s.name} ${s.colour}`))).toEqual([
      'A',
      '2 white-orange orange',
      'B',
      '7 red-orange orange',
      'C',
    ]);
  });

  it('says where the conductors meet, through the parts between the ends', () => {
    expect(pathSentence({ path: [hop('a', 2, 'ring'), hop('b', 2, 'ring'), hop('c', 2, 'ring')] })).toBe(
      'The conductors of A and C meet on pair 2 (white-orange) ring (the orange conductor), through B.',
    );
    expect(pathSentence({ path: [] })).toBe('');
  });
});
