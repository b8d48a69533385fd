import { useSignOut } from "@/features/auth/api/auth.queries";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";

/**
 * Signs out, then reloads into the sign-in page: a full reload drops every cached record in memory,
 * which matters on a tablet the whole shop shares.
 */
export function useSignOutAction() {
  const signOut = useSignOut();
  const run = () =>
    signOut.mutate(undefined, {
      onSuccess: () => window.location.replace(paths.signIn),
      onError: (error) => toast.error(`Could not sign out: ${error.message}`),
    });
  return { signOut: run, signingOut: signOut.isPending || signOut.isSuccess };
}
