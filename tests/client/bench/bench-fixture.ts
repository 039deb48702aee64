/** A small invented installation for Bench component tests: one KSU, one bridging adapter, two six-key sets. */
import type { Component, ComponentOptions } from 'vue';
import { createPinia, setActivePinia } from 'pinia';
import { mount } from '@vue/test-utils';
import { Position } from '@vue-flow/core';
import { PlanSchema, type Plan } from '@shared/engine';
import { useBenchStore } from '@/stores/bench.store';

export function twoSetPlan(): Plan {
  return PlanSchema.parse({
    version: 1,
    name: 'Workshop test board',
    ksu: {
      id: 'ksu',
      name: 'Bench KSU',
      lines: [1, 2, 3, 4, 5].map((n) => ({ number: n, directoryNumber: `555010${n}` })),
      stations: [
        { id: 'st-front', code: '1', label: 'Front desk' },
        { id: 'st-back', code: '2', label: 'Back room' },
      ],
      ports: 4,
      position: { x: 0, y: 0 },
    },
    sets: [
      {
        id: 'front',
        name: 'Front desk',
        template: 'six-key',
        station: 'st-front',
        ringerLines: [1],
        position: { x: 600, y: 0 },
      },
      {
        id: 'back',
        name: 'Back room',
        template: 'six-key',
        station: 'st-back',
        ringerLines: [1],
        position: { x: 600, y: 300 },
      },
    ],
    adapters: [{ id: 'bridge', name: 'Bridge', template: 'bridging-adapter', position: { x: 300, y: 0 } }],
    cables: [
      { id: 'c-ksu', from: { part: 'bridge', port: 'plug' }, to: { part: 'ksu', port: 'port-1' } },
      { id: 'c-front', from: { part: 'front', port: 'cord' }, to: { part: 'bridge', port: 'jack-1' } },
      { id: 'c-back', from: { part: 'back', port: 'cord' }, to: { part: 'bridge', port: 'jack-2' } },
    ],
  });
}

/** A fresh Pinia with the bench store holding `plan`. */
export function benchWith(plan: Plan = twoSetPlan()) {
  setActivePinia(createPinia());
  const store = useBenchStore();
  store.load('plan-1', plan, '2026-01-01T00:00:00.000Z');
  return store;
}

/**
 * Mount a canvas node component outside a flow, with the props vue-flow would give it.
 * Handles need a mounted flow; their own behaviour belongs to vue-flow, not to these nodes.
 */
export function mountNode(
  component: Component,
  partId: string,
  type: string,
  dimensions: { width: number; height: number },
  mixins: ComponentOptions[] = [],
) {
  return mount(component, {
    props: {
      id: partId,
      type,
      selected: false,
      connectable: true,
      position: { x: 0, y: 0 },
      dimensions,
      data: { partId },
      events: {},
      dragging: false,
      resizing: false,
      zIndex: 0,
      targetPosition: Position.Left,
      sourcePosition: Position.Right,
      dragHandle: undefined,
    } as never,
    global: { stubs: { Handle: true }, mixins },
  });
}
