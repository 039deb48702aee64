import { describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import SignUpForm from '@/components/forms/SignUpForm.vue';

describe('new-password advice (OWASP ASVS 4.0.3 V2.1.7, V2.1.8)', () => {
  it('loads the strength estimate after typing stops, shows its advice and keeps a weak password from being sent', async () => {
    const wrapper = mount(SignUpForm, { attachTo: document.body });
    const fields = {
      'sign-up-name': 'Ada Linesman',
      'sign-up-email': 'ada@example.org',
      // 12 characters, so the length rule passes; "password" + digits is in zxcvbn's common-password list.
      'sign-up-password': 'password1234',
    };
    for (const [id, value] of Object.entries(fields)) await wrapper.get(`#${id}`).setValue(value);

    await vi.waitFor(() => expect(wrapper.text()).toContain('This password is easy to guess.'), {
      timeout: 10_000,
    });
    expect(wrapper.get('#sign-up-password').attributes('aria-invalid')).toBe('true');
    await wrapper.get('form').trigger('submit');
    await flushPromises();
    expect(wrapper.emitted('submit')).toBeUndefined();

    // A few unrelated words pass (zxcvbn score ≥ 3, MIN_PASSWORD_SCORE in shared/schemas/password-strength.ts).
    await wrapper.get('#sign-up-password').setValue('lamp lead wink cadence');
    await vi.waitFor(() => expect(wrapper.text()).not.toContain('easy to guess'), { timeout: 10_000 });
    await wrapper.get('form').trigger('submit');
    expect(wrapper.emitted('submit')).toHaveLength(1);
    wrapper.unmount();
  });
});
