import { PASSWORD_MIN_LENGTH, passwordResetCompleteSchema } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Form, PasswordField, SubmitButton } from '../../../components/ui/form.tsx';
import { useCompletePasswordReset } from '../api/complete-password-reset.ts';

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const complete = useCompletePasswordReset({ onSuccess: onDone });
  return (
    <Form
      schema={passwordResetCompleteSchema}
      defaultValues={{ token, password: '' }}
      onSubmit={(values) => complete.mutateAsync(values)}
      errorDetail={(error) =>
        error.code === 'invalid_token' ? (
          <p>
            Reset links work once and only for a limited time.{' '}
            <Link to={paths.auth.forgotPassword.getHref()}>Ask for a new link</Link>.
          </p>
        ) : null
      }
    >
      <PasswordField
        name="password"
        label="New password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        autoComplete="new-password"
      />
      <SubmitButton pendingLabel="Saving…" className="w-full sm:w-auto">
        Save new password
      </SubmitButton>
    </Form>
  );
}
