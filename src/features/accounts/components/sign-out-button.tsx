import { useNavigate } from "react-router";
import { toast } from "../../../components/ui/toast";
import { useSignOut } from "../api/sign-out";

/** Signs out, forgets everything cached for this member, and goes home. Errors become a toast. */
export function SignOutButton({ className = "", onDone }: { className?: string; onDone?: () => void }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <button
      type="button"
      className={className}
      disabled={signOut.isPending}
      onClick={async () => {
        try {
          // Awaited rather than a mutate callback: this button may unmount once the member is gone.
          await signOut.mutateAsync();
        } catch {
          return; // shown as a toast by the query client
        }
        onDone?.();
        toast.success("You are signed out.");
        void navigate("/");
      }}
    >
      {signOut.isPending ? "Signing out…" : "Sign out"}
    </button>
  );
}
