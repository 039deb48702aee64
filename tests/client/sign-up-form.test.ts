import { describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import SignUpForm from '@/components/forms/SignUpForm.vue';
import { ApiError } from '@/api/client';

describe('SignUpForm', () => {
  it('refuses a short password with the shared rule and keeps the other fields', async () => {
    const wrapper = mount(SignUpForm, { attachTo: document.body });
    await wrapper.get('#sign-up-name').setValue('Ada Linesman');
    await wrapper.get('#sign-up-email').setValue('ada@example.org');
    await wrapper.get('#sign-up-password').setValue('short');
    await wrapper.get('form').trigger('submit');
    await flushPromises();

    // 12-character minimum: OWASP ASVS 4.0.3 V2.1.1, as written in shared/schemas/auth.schema.ts.
    expect(wrapper.text()).toContain('Use at least 12 characters');
    expect(wrapper.emitted('submit')).toBeUndefined();
    expect((wrapper.get('#sign-up-name').element as HTMLInputElement).value).toBe('Ada Linesman');
    wrapper.unmount();
  });

  it('emits trimmed values when everything is valid', async () => {
    const wrapper = mount(SignUpForm, { attachTo: document.body });
    await wrapper.get('#sign-up-name').setValue('  Ada Linesman ');
    await wrapper.get('#sign-up-email').setValue('Ada@Example.org');
    await wrapper.get('#sign-up-password').setValue('twelve chars ok');
    await wrapper.get('form').trigger('submit');

    // DisplayNameSchema and EmailSchema trim; EmailSchema lower-cases (shared/schemas/auth.schema.ts).
    expect(wrapper.emitted('submit')).toEqual([
      [{ displayName: 'Ada Linesman', email: 'ada@example.org', password: 'twelve chars ok' }],
    ]);
    wrapper.unmount();
  });

  it('shows a taken e-mail on the e-mail field, not as a banner', async () => {
    const wrapper = mount(SignUpForm, { attachTo: document.body });
    await wrapper.setProps({ error: new ApiError(409, 'EMAIL_TAKEN', 'E-mail already registered') });

    expect(wrapper.text()).toContain('An account with this e-mail already exists.');
    expect(wrapper.find('[data-testid="form-error"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('shows rate limiting and network trouble as a banner', async () => {
    const wrapper = mount(SignUpForm, { attachTo: document.body });
    await wrapper.setProps({ error: new ApiError(429, 'RATE_LIMITED', 'Too many requests') });
    expect(wrapper.get('[data-testid="form-error"]').text()).toContain('Too many attempts');

    await wrapper.setProps({ error: new ApiError(0, 'NETWORK', 'offline') });
    expect(wrapper.get('[data-testid="form-error"]').text()).toContain('cannot reach its server');
    wrapper.unmount();
  });
});
