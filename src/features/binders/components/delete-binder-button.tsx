import { useState } from "react";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { Button } from "../../../components/ui/button";
import { ConfirmDialog } from "../../../components/ui/confirm-dialog";
import { toast } from "../../../components/ui/toast";
import { plural } from "../../../lib/format";
import { useDeleteBinder } from "../api/delete-binder";

/** Delete, after asking; errors become a toast. */
export function DeleteBinderButton({ binder, onDeleted, className = "" }: { binder: BinderSummary; onDeleted?: () => void; className?: string }) {
  const [asking, setAsking] = useState(false);
  const remove = useDeleteBinder();
  return (
    <>
      <Button variant="secondary" className={className} onClick={() => setAsking(true)}>
        Delete<span className="sr-only"> “{binder.name}”</span>
      </Button>
      <ConfirmDialog
        open={asking}
        title={`Delete “${binder.name}”?`}
        confirmLabel="Delete binder"
        busyLabel="Deleting…"
        busy={remove.isPending}
        onCancel={() => setAsking(false)}
        onConfirm={async () => {
          try {
            await remove.mutateAsync(binder.id);
          } catch {
            setAsking(false);
            return; // shown as a toast by the query client
          }
          setAsking(false);
          toast.success(`“${binder.name}” is deleted.`);
          onDeleted?.();
        }}
      >
        <p>
          {binder.itemCount > 0
            ? `The binder and your notes on its ${plural(binder.itemCount, "strip")} go. The strips themselves stay in the gallery.`
            : "The binder is empty; nothing else is lost."}{" "}
          This cannot be undone.
        </p>
      </ConfirmDialog>
    </>
  );
}
