/** The guest bench's drawing carried through sign-up: saved as the new account's plan, then opened on the Bench. */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h } from 'vue';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query';
import type { User } from '@shared/schemas';
import { ApiError } from '@/api/client';
import { useAfterSignIn } from '@/composables/use-after-sign-in';
import { GUEST_KEEP_NEXT, GUEST_PLAN_KEY } from '@/composables/bench/use-guest-plan';
import { twoSetPlan } from './bench-fixture';

const api = vi.hoisted(() => ({ create: vi.fn() }));
vi.mock('@/api/plans', () => ({ plansApi: api }));

const newUser: User = {
  id: 'u-9',
  email: 'wren@example.org',
  displayName: 'Wren',
  role: 'restorer',
  createdAt: '2026-01-05T10:00:00.000Z',
};

async function signedInFrom(next: string) {
  const Blank = { render: () => h('p') };
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/sign-up', component: Blank },
      { path: '/plans', component: Blank },
      { path: '/try', component: Blank },
      { path: '/plans/:id', name: 'bench', component: Blank },
    ],
  });
  await router.push({ path: '/sign-up', query: { next } });
  let goOn!: ReturnType<typeof useAfterSignIn>;
  const Host = defineComponent({
    setup() {
      goOn = useAfterSignIn();
      return () => h('div');
    },
  });
  mount(Host, {
    global: { plugins: [createPinia(), router, [VueQueryPlugin, { queryClient: new QueryClient() }]] },
  });
  await goOn(newUser);
  await flushPromises();
  return router.currentRoute.value.fullPath;
}

beforeEach(() => {
  sessionStorage.clear();
  vi.clearAllMocks();
});

describe('keeping the guest bench’s work', () => {
  const kept = { ...twoSetPlan(), name: 'Tried as a guest' };

  it('saves the kept drawing as the user’s plan and opens it', async () => {
    sessionStorage.setItem(GUEST_PLAN_KEY, JSON.stringify(kept));
    api.create.mockResolvedValue({ id: 'p-new' });
    expect(await signedInFrom(GUEST_KEEP_NEXT)).toBe('/plans/p-new');
    expect(api.create).toHaveBeenCalledTimes(1);
    expect(api.create.mock.calls[0][0]).toMatchObject({ name: 'Tried as a guest', sets: kept.sets });
    expect(sessionStorage.getItem(GUEST_PLAN_KEY)).toBeNull();
  });

  it('keeps the drawing and goes back to the guest bench when saving fails', async () => {
    sessionStorage.setItem(GUEST_PLAN_KEY, JSON.stringify(kept));
    api.create.mockRejectedValue(new ApiError(0, 'NETWORK', 'offline'));
    expect(await signedInFrom(GUEST_KEEP_NEXT)).toBe(GUEST_KEEP_NEXT);
    expect(JSON.parse(sessionStorage.getItem(GUEST_PLAN_KEY)!).name).toBe('Tried as a guest');
  });

  it('saves nothing on an ordinary sign-in', async () => {
    sessionStorage.setItem(GUEST_PLAN_KEY, JSON.stringify(kept));
    expect(await signedInFrom('/plans')).toBe('/plans');
    expect(api.create).not.toHaveBeenCalled();
  });
});
