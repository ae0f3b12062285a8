import { useState } from "react";
import { Button } from "../../../components/ui/button";
import { ConfirmDialog } from "../../../components/ui/confirm-dialog";
import { useDeleteStrip } from "../api/delete-strip";

/** Delete, after a confirmation; errors become a toast (the dialog stays open to try again). */
export function DeleteStripButton({ stripId, title, onDeleted }: { stripId: number; title: string; onDeleted: () => void }) {
  const [open, setOpen] = useState(false);
  const deleteStrip = useDeleteStrip(stripId);
  return (
    <>
      <Button variant="secondary" className="text-danger" onClick={() => setOpen(true)}>
        Delete
      </Button>
      <ConfirmDialog
        open={open}
        title={`Delete “${title}”?`}
        confirmLabel="Delete strip"
        busyLabel="Deleting…"
        busy={deleteStrip.isPending}
        onCancel={() => setOpen(false)}
        onConfirm={async () => {
          try {
            await deleteStrip.mutateAsync();
          } catch {
            return; // shown as a toast by the query client
          }
          setOpen(false);
          onDeleted();
        }}
      >
        <p>The strip, its photo and its bands are removed for good. Binders that saved it lose it too.</p>
      </ConfirmDialog>
    </>
  );
}
