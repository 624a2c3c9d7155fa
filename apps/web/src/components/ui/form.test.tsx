// @vitest-environment happy-dom
import { joinSchema } from '@scrap-relay/shared';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../lib/api-client.ts';
import { buttonNamed, byLabel, byRole, cleanup, click, render, typeInto, waitFor } from '../../testing/render.tsx';
import { Form, PasswordField, SubmitButton, TextField } from './form.tsx';

afterEach(cleanup);

function JoinLikeForm({ onSubmit }: { onSubmit: (values: unknown) => Promise<unknown> }) {
  return (
    <Form schema={joinSchema} defaultValues={{ inviteCode: '', name: '', email: '', password: '' }} onSubmit={onSubmit}>
      <TextField name="inviteCode" label="Guild invite code" hint="From your guild." />
      <TextField name="name" label="Your name" />
      <TextField name="email" label="E-mail address" type="email" />
      <PasswordField name="password" label="Choose a password" />
      <SubmitButton>Join</SubmitButton>
    </Form>
  );
}

async function fillValid(root: HTMLElement) {
  await typeInto(byLabel(root, 'Guild invite code'), 'LARK-2031');
  await typeInto(byLabel(root, 'Your name'), 'Hester Quill');
  await typeInto(byLabel(root, 'E-mail address'), 'Hester@Larkhollow.example');
  await typeInto(byLabel(root, 'Choose a password'), 'long enough password');
}

const describedText = (control: HTMLElement) =>
  (control.getAttribute('aria-describedby') ?? '')
    .split(' ')
    .filter(Boolean)
    .map((id) => document.getElementById(id)?.textContent)
    .join(' | ');

describe('Form', () => {
  it('shows the shared schema’s messages on the fields, tied to them by aria-describedby', async () => {
    const onSubmit = vi.fn(async (_values: unknown) => undefined);
    const { container } = await render(<JoinLikeForm onSubmit={onSubmit} />);

    await click(buttonNamed(container, 'Join'));

    const email = await waitFor(() => {
      const control = byLabel(container, 'E-mail address');
      expect(control.getAttribute('aria-invalid')).toBe('true');
      return control;
    });
    expect(describedText(email)).toContain('Enter a valid e-mail address.');
    expect(describedText(byLabel(container, 'Guild invite code'))).toBe('From your guild. | ✗Enter the guild invite code.');
    expect(describedText(byLabel(container, 'Choose a password'))).toContain('Use at least 10 characters.');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('submits the parsed values (the schema trims and lower-cases the e-mail)', async () => {
    const onSubmit = vi.fn(async (_values: unknown) => undefined);
    const { container } = await render(<JoinLikeForm onSubmit={onSubmit} />);
    await fillValid(container);

    await click(buttonNamed(container, 'Join'));

    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit.mock.calls[0]?.[0]).toEqual({
      inviteCode: 'LARK-2031',
      name: 'Hester Quill',
      email: 'hester@larkhollow.example',
      password: 'long enough password',
    });
  });

  it('puts API field errors on their fields and the message in an alert', async () => {
    const onSubmit = vi.fn(async () => {
      throw new ApiError(409, 'email_taken', 'That e-mail address already has an account.', {
        email: 'Already registered: sign in instead.',
        referrer: 'Not a field of this form.',
      });
    });
    const { container } = await render(<JoinLikeForm onSubmit={onSubmit} />);
    await fillValid(container);

    await click(buttonNamed(container, 'Join'));

    const alert = await waitFor(() => {
      const [found] = byRole(container, 'alert');
      expect(found).toBeDefined();
      return found!;
    });
    expect(alert.textContent).toContain('That e-mail address already has an account.');
    // A field the form does not have is still shown, in the alert.
    expect(alert.textContent).toContain('Not a field of this form.');
    const email = byLabel(container, 'E-mail address');
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(describedText(email)).toContain('Already registered: sign in instead.');
    expect(document.activeElement).toBe(email);
  });
});
