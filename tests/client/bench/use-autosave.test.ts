import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h, nextTick, ref } from 'vue';
import { mount } from '@vue/test-utils';
import { ApiError } from '@/api/client';
import { useAutosave, useEditsBackup } from '@/composables/bench/use-autosave';
import { twoSetPlan } from './bench-fixture';

type Save = (doc: unknown, base?: string) => Promise<{ updatedAt: string }>;

const BACKUP = 'test.unsaved.plan-1';

function harness(save: Save) {
  const revision = ref(0);
  let doc = twoSetPlan();
  const saved: string[] = [];
  let autosave!: ReturnType<typeof useAutosave>;
  const Host = defineComponent({
    setup() {
      autosave = useAutosave({
        revision,
        document: () => doc,
        baseUpdatedAt: () => saved.at(-1) ?? 'base',
        save: save as never,
        onSaved: (at) => saved.push(at),
        delayMs: 800,
        backupKey: BACKUP,
      });
      return () => h('div');
    },
  });
  const wrapper = mount(Host);
  return {
    wrapper,
    saved,
    get autosave() {
      return autosave;
    },
    edit(name: string) {
      doc = { ...doc, name };
      revision.value += 1;
    },
  };
}

describe('useAutosave', () => {
  beforeEach(() => {
    vi.useFakeTimers();
    localStorage.clear();
  });
  afterEach(() => vi.useRealTimers());

  it('waits for a pause in editing, then saves the newest document once', async () => {
    const save = vi.fn<Save>(async () => ({ updatedAt: 't1' }));
    const h = harness(save);
    h.edit('A');
    await nextTick();
    vi.advanceTimersByTime(500);
    h.edit('B');
    await nextTick();
    expect(h.autosave.state.value).toBe('pending');
    vi.advanceTimersByTime(799);
    expect(save).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(1);
    expect(save).toHaveBeenCalledTimes(1);
    expect((save.mock.calls[0][0] as { name: string }).name).toBe('B');
    expect(save.mock.calls[0][1]).toBe('base');
    expect(h.autosave.state.value).toBe('saved');
    h.wrapper.unmount();
  });

  it('goes offline when the network drops, keeps the edits and retries with growing delays', async () => {
    let fail = true;
    const save = vi.fn<Save>(async () => {
      if (fail) throw new ApiError(0, 'NETWORK', 'offline');
      return { updatedAt: 't2' };
    });
    const h = harness(save);
    h.edit('A');
    await nextTick();
    await vi.advanceTimersByTimeAsync(800);
    expect(h.autosave.state.value).toBe('offline');
    await vi.advanceTimersByTimeAsync(1000); // first retry after 1 s
    expect(save).toHaveBeenCalledTimes(2);
    h.edit('C');
    await nextTick();
    expect(h.autosave.state.value).toBe('offline');
    // While offline the newest edits are also kept in the browser, with the version they were based on.
    expect(useEditsBackup(BACKUP).value?.document.name).toBe('C');
    expect(useEditsBackup(BACKUP).value?.baseUpdatedAt).toBe('base');
    fail = false;
    await vi.advanceTimersByTimeAsync(2000); // second retry after 2 s sends the newest document
    expect(save).toHaveBeenCalledTimes(3);
    expect((save.mock.calls[2][0] as { name: string }).name).toBe('C');
    expect(h.autosave.state.value).toBe('saved');
    expect(useEditsBackup(BACKUP).value).toBeNull();
    h.wrapper.unmount();
  });

  it('stops on a conflict (409) and does not retry by itself', async () => {
    const save = vi.fn<Save>(async () => {
      throw new ApiError(409, 'CONFLICT', 'newer copy');
    });
    const h = harness(save);
    h.edit('A');
    await nextTick();
    await vi.advanceTimersByTimeAsync(800);
    expect(h.autosave.state.value).toBe('conflict');
    h.edit('B');
    await nextTick();
    await vi.advanceTimersByTimeAsync(60_000);
    expect(save).toHaveBeenCalledTimes(1);
    h.wrapper.unmount();
  });
});
