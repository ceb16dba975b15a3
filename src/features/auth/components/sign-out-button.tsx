import { Button, type ButtonVariant } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/notes';
import { useSignOut } from '../api/sign-out';

export function SignOutButton({ onSignedOut, variant = 'secondary' }: { onSignedOut: () => unknown; variant?: ButtonVariant }) {
  const signOut = useSignOut({ onSignedOut });
  return (
    <div className="flex flex-col items-start gap-3">
      <Button variant={variant} busy={signOut.isPending} busyLabel="Signing out…" onClick={() => signOut.mutate()}>
        Sign out
      </Button>
      <FormAlert message={signOut.error ? signOut.error.message : null} />
    </div>
  );
}
