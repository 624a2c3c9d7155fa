import { signInSchema } from '@scrap-relay/shared';
import { Form, PasswordField, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useSignIn } from '../api/sign-in.ts';

/** Where the member goes next is decided by the page's guard once the session shows them signed in. */
export function SignInForm() {
  const signIn = useSignIn();
  return (
    <Form schema={signInSchema} defaultValues={{ email: '', password: '' }} onSubmit={(values) => signIn.mutateAsync(values)}>
      <TextField
        name="email"
        label="E-mail address"
        type="email"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
      />
      <PasswordField name="password" label="Password" autoComplete="current-password" />
      <SubmitButton pendingLabel="Signing in…" className="w-full sm:w-auto">
        Sign in
      </SubmitButton>
    </Form>
  );
}
