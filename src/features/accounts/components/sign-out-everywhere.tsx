import { useState } from "react";
import { useNavigate } from "react-router";
import { Button } from "../../../components/ui/button";
import { ConfirmDialog } from "../../../components/ui/confirm-dialog";
import { Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { useSignOutEverywhere } from "../api/sign-out-everywhere";

/** Ends every session of this member on every device, this one too (a lost phone, a shared computer). */
export function SignOutEverywhere() {
  const [asking, setAsking] = useState(false);
  const mutation = useSignOutEverywhere();
  const navigate = useNavigate();
  return (
    <div className="space-y-3">
      <p className="text-ink-soft">
        Signed in on a computer that is not yours, or lost your phone? This signs you out on every device and browser,
        here too. Changing your password does the same for your other devices.
      </p>
      {mutation.isError && (
        <Notice tone="error" title="Could not sign you out everywhere" live>
          <p>{errorMessage(mutation.error)}</p>
        </Notice>
      )}
      <Button variant="secondary" onClick={() => setAsking(true)}>
        Sign out everywhere
      </Button>
      <ConfirmDialog
        open={asking}
        title="Sign out on every device?"
        confirmLabel="Sign out everywhere"
        busyLabel="Signing out…"
        busy={mutation.isPending}
        onCancel={() => setAsking(false)}
        onConfirm={async () => {
          try {
            await mutation.mutateAsync();
          } catch {
            setAsking(false);
            return;
          }
          toast.success("You are signed out on every device.");
          void navigate("/");
        }}
      >
        <p>You will need to sign in again everywhere, including in this browser.</p>
      </ConfirmDialog>
    </div>
  );
}
