import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { useSignOut } from '../api/sign-out.ts';

export function SignOutButton() {
  // A full page load after signing out leaves nothing of the member's data in memory (shared tablets).
  const signOut = useSignOut({ onSuccess: () => window.location.assign(paths.auth.signIn.getHref()) });
  return (
    <div className="space-y-3">
      <Button variant="secondary" onClick={() => signOut.mutate()} isPending={signOut.isPending} pendingLabel="Signing out…">
        Sign out
      </Button>
      {signOut.isError ? (
        <Alert tone="error">
          <p>{signOut.error.message}</p>
        </Alert>
      ) : null}
    </div>
  );
}
