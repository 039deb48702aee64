import { describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import SignInForm from '@/components/forms/SignInForm.vue';
import { ApiError } from '@/api/client';

function mountForm(props: Record<string, unknown> = {}) {
  return mount(SignInForm, { props, attachTo: document.body });
}

const emailInput = (wrapper: ReturnType<typeof mountForm>) => wrapper.get('#sign-in-email');
const passwordInput = (wrapper: ReturnType<typeof mountForm>) => wrapper.get('#sign-in-password');

describe('SignInForm', () => {
  it('shows a message under each empty field and does not submit', async () => {
    const wrapper = mountForm();
    await wrapper.get('form').trigger('submit');
    await flushPromises();

    // Messages from shared/schemas/auth.schema.ts (EmailSchema, SignInSchema); our own wording.
    expect(wrapper.text()).toContain('Enter a valid e-mail address');
    expect(wrapper.text()).toContain('Enter your password');
    expect(wrapper.emitted('submit')).toBeUndefined();
    expect(emailInput(wrapper).attributes('aria-invalid')).toBe('true');
    wrapper.unmount();
  });

  it('flags an invalid e-mail once the field is left', async () => {
    const wrapper = mountForm();
    await emailInput(wrapper).setValue('not-an-address');
    await emailInput(wrapper).trigger('blur');
    await flushPromises();

    expect(wrapper.text()).toContain('Enter a valid e-mail address');
    // The password field was never visited, so it stays quiet.
    expect(wrapper.text()).not.toContain('Enter your password');
    wrapper.unmount();
  });

  it('clears the message as soon as the input becomes valid', async () => {
    const wrapper = mountForm();
    await wrapper.get('form').trigger('submit');
    await emailInput(wrapper).setValue('wren@example.org');
    await flushPromises();

    expect(wrapper.text()).not.toContain('Enter a valid e-mail address');
    expect(wrapper.text()).toContain('Enter your password');
    wrapper.unmount();
  });

  it('emits the parsed values: trimmed, lower-case e-mail', async () => {
    const wrapper = mountForm();
    await emailInput(wrapper).setValue('  Wren.Calloway@Example.ORG ');
    await passwordInput(wrapper).setValue('correct horse battery');
    await wrapper.get('form').trigger('submit');

    // EmailSchema trims and lower-cases (shared/schemas/auth.schema.ts).
    expect(wrapper.emitted('submit')).toEqual([
      [{ email: 'wren.calloway@example.org', password: 'correct horse battery' }],
    ]);
    wrapper.unmount();
  });

  it('shows a wrong-credentials answer without losing what was typed', async () => {
    const wrapper = mountForm();
    await emailInput(wrapper).setValue('wren@example.org');
    await passwordInput(wrapper).setValue('not the password');
    await wrapper.setProps({ error: new ApiError(401, 'BAD_CREDENTIALS', 'Invalid credentials') });

    // Wording chosen for this product (common practice: one message for unknown e-mail and wrong password).
    expect(wrapper.get('[data-testid="form-error"]').text()).toContain('E-mail or password is wrong');
    expect((emailInput(wrapper).element as HTMLInputElement).value).toBe('wren@example.org');
    expect((passwordInput(wrapper).element as HTMLInputElement).value).toBe('not the password');
    wrapper.unmount();
  });

  it('puts server field details beside the field', async () => {
    const wrapper = mountForm();
    await wrapper.setProps({
      error: new ApiError(400, 'VALIDATION_FAILED', 'Check the fields', {
        email: ['That address cannot receive mail'],
      }),
    });
    expect(wrapper.text()).toContain('That address cannot receive mail');
    wrapper.unmount();
  });

  it('shows a loading, disabled button while signing in', () => {
    const wrapper = mountForm({ pending: true });
    const button = wrapper.get('button[type="submit"]');
    expect(button.attributes('disabled')).toBeDefined();
    wrapper.unmount();
  });
});
