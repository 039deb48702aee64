/** Puts one demonstration step on the Bench canvas (through the bench store) and finds its revealed finding. */
import { computed, watch, type Ref } from 'vue';
import type { Finding } from '@shared/engine';
import type { DemonstrationSpec, Reveal } from '@shared/training/demonstration.schema';
import { useBenchStore } from '@/stores/bench.store';

export function matchesReveal(finding: Finding, reveal: Reveal): boolean {
  const same = <T>(a: T[], b: T[]) => JSON.stringify([...a].sort()) === JSON.stringify([...b].sort());
  return finding.code === reveal.code && same(finding.sets, reveal.sets) && same(finding.lines, reveal.lines);
}

export function useDemonstrationStage(stageId: Ref<string>, spec: Ref<DemonstrationSpec | undefined>, index: Ref<number>, revealed: Ref<boolean>) {
  const store = useBenchStore();
  const step = computed(() => spec.value?.steps[index.value]);
  const finding = computed(() => {
    const reveal = step.value?.reveal;
    return reveal ? (store.findings.find((f) => matchesReveal(f, reveal)) ?? null) : null;
  });

  watch(
    spec,
    (s) => {
      if (s) store.load(stageId.value, s.plan);
    },
    { immediate: true },
  );
  watch(
    [step, revealed, () => store.plan],
    () => {
      if (!step.value || !store.plan) return;
      store.setSimState(step.value.state);
      store.selectFinding(revealed.value ? finding.value : null);
    },
    { immediate: true },
  );

  const tones = computed(() => (store.evaluation?.sets ?? []).flatMap((s) => s.tones));
  return { store, step, finding, tones };
}
