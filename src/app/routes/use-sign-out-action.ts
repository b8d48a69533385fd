import { useSignOut } from "@/features/auth/api/auth.queries";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { cachedUserId } from "@/lib/offline/owner";

/**
 * Signs out, then reloads into the sign-in page: a full reload drops every cached record in memory, which matters on
 * a tablet the whole shop shares. A painter's tablet also forgets its booth cache and its queue of entries; when
 * entries are still waiting to send, the painter is asked first (signing out deletes them).
 */
export function useSignOutAction() {
  const signOut = useSignOut();
  const run = async () => {
    const offline = cachedUserId() ? await import("@/lib/offline/sign-out") : null;
    const waiting = offline?.waitingCount() ?? 0;
    if (waiting && !window.confirm(`${waiting} ${waiting === 1 ? "entry is" : "entries are"} still waiting to send. Signing out deletes ${waiting === 1 ? "it" : "them"} from this tablet. Sign out anyway?`)) return;
    signOut.mutate(undefined, {
      onSuccess: async () => {
        await offline?.forgetTablet();
        window.location.replace(paths.signIn);
      },
      onError: (error) => toast.error(`Could not sign out: ${error.message}`),
    });
  };
  return { signOut: () => void run(), signingOut: signOut.isPending || signOut.isSuccess };
}
