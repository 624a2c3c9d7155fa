import { passwordResetRequestSchema } from '@scrap-relay/shared';
import { useState } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { Form, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useRequestPasswordReset } from '../api/request-password-reset.ts';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [sentTo, setSentTo] = useState<string | null>(null);

  if (sentTo) {
    return (
      <Alert tone="success" title="Check your e-mail">
        <p>
          If an account exists for <strong>{sentTo}</strong>, we have sent it a link to choose a new password. It can take a
          few minutes to arrive; look in your spam or junk folder too.
        </p>
        <p>The link works once. If it has stopped working, you can ask for another here.</p>
      </Alert>
    );
  }

  return (
    <Form
      schema={passwordResetRequestSchema}
      defaultValues={{ email: '' }}
      onSubmit={async (values) => {
        await request.mutateAsync(values);
        setSentTo(values.email);
      }}
    >
      <TextField
        name="email"
        label="E-mail address"
        hint="The address you signed up with."
        type="email"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
      />
      <SubmitButton pendingLabel="Sending…" className="w-full sm:w-auto">
        Send me a link
      </SubmitButton>
    </Form>
  );
}
