import { joinSchema, PASSWORD_MIN_LENGTH } from '@scrap-relay/shared';
import { Form, PasswordField, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useJoin } from '../api/join.ts';

/** On success the session holds the new member; the join page's guard then moves them on to "check your e-mail". */
export function JoinForm() {
  const join = useJoin();
  return (
    <Form
      schema={joinSchema}
      defaultValues={{ inviteCode: '', name: '', email: '', password: '' }}
      onSubmit={(values) => join.mutateAsync(values)}
    >
      <TextField
        name="inviteCode"
        label="Guild invite code"
        hint="The code your guild shares with members, at a meeting or in its newsletter."
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
      />
      <TextField name="name" label="Your name" hint="Shown to the members you pass fabric to and from." autoComplete="name" />
      <TextField
        name="email"
        label="E-mail address"
        hint="We send a link to this address to confirm it is yours."
        type="email"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
      />
      <PasswordField
        name="password"
        label="Choose a password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words in a row are long and easy to remember.`}
        autoComplete="new-password"
      />
      <SubmitButton pendingLabel="Creating your account…" className="w-full sm:w-auto">
        Join the exchange
      </SubmitButton>
    </Form>
  );
}
