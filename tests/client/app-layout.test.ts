import { afterEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h } from 'vue';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query';
import { createMemoryHistory } from 'vue-router';
import { NDialogProvider, NMessageProvider } from 'naive-ui';
import type { Role, User } from '@shared/schemas';
import AppLayout from '@/layouts/AppLayout.vue';
import { createAppRouter } from '@/router';
import { useSessionStore } from '@/stores/session.store';

function userWith(role: Role): User {
  return {
    id: `u-${role}`,
    email: `${role}@example.org`,
    displayName: 'Ada Linesman',
    role,
    createdAt: '2026-01-05T10:00:00.000Z',
  };
}

async function mountLayout(user: User | null, path = '/') {
  localStorage.clear();
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => Response.json({ user })),
  );
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createAppRouter(createMemoryHistory(), pinia);
  await router.push(path);
  const Shell = defineComponent(
    () => () => h(NDialogProvider, () => h(NMessageProvider, () => h(AppLayout))),
  );
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const wrapper = mount(Shell, { global: { plugins: [pinia, router, [VueQueryPlugin, { queryClient }]] } });
  await flushPromises();
  return { wrapper, session: useSessionStore(pinia) };
}

const navLabels = (wrapper: Awaited<ReturnType<typeof mountLayout>>['wrapper']) =>
  wrapper.findAll('nav[aria-label="Main"] a').map((a) => a.text());

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('AppLayout', () => {
  it('shows sign-in and sign-up to an anonymous visitor, and no area navigation', async () => {
    // The landing page has its own light shell; the app layout frames every other public page.
    const { wrapper } = await mountLayout(null, '/forbidden');
    expect(wrapper.find('nav[aria-label="Main"]').exists()).toBe(false);
    expect(wrapper.text()).toContain('Sign in');
    expect(wrapper.text()).toContain('Create account');
    wrapper.unmount();
  });

  // Areas per role are our own product decision (common practice, no published source).
  it('shows a restorer Plans and Account only', async () => {
    const { wrapper } = await mountLayout(userWith('restorer'), '/plans');
    expect(navLabels(wrapper)).toEqual(['Plans', 'Account']);
    expect(wrapper.get('[data-testid="user-menu"]').attributes('aria-label')).toBe(
      'Account menu for Ada Linesman',
    );
    wrapper.unmount();
  });

  it('shows an administrator every area and marks the current one', async () => {
    const { wrapper } = await mountLayout(userWith('admin'), '/people');
    expect(navLabels(wrapper)).toEqual(['Plans', 'Drills', 'People', 'Account']);
    expect(wrapper.get('[data-testid="nav-people"]').attributes('aria-current')).toBe('page');
    wrapper.unmount();
  });

  it('updates the navigation when the user changes', async () => {
    const { wrapper, session } = await mountLayout(userWith('trainee'), '/account');
    expect(navLabels(wrapper)).toEqual(['Plans', 'Drills', 'Account']);
    session.setUser(null);
    await flushPromises();
    expect(wrapper.find('nav[aria-label="Main"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('labels the theme toggle with what it will do', async () => {
    vi.stubGlobal('matchMedia', () => ({ matches: false, addEventListener() {}, removeEventListener() {} }));
    const { wrapper } = await mountLayout(null);
    const toggle = wrapper.get('[data-testid="theme-toggle"]');
    expect(toggle.attributes('aria-label')).toBe('Switch to dark theme');
    await toggle.trigger('click');
    expect(toggle.attributes('aria-label')).toBe('Switch to light theme');
    wrapper.unmount();
  });
});
