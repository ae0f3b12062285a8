import type { BinderSummary } from "../../../../shared/schemas/binders";
import { toast } from "../../../components/ui/toast";
import { useUpdateBinder, type BinderChanges } from "../api/update-binder";
import { BinderForm, type BinderValues } from "./binder-form";

/** Only the fields that changed: the server refuses an edit that changes nothing. */
export function binderChanges(binder: Pick<BinderSummary, "name" | "description" | "visibility">, values: BinderValues): BinderChanges {
  const changes: BinderChanges = {};
  if (values.name !== binder.name) changes.name = values.name;
  if (values.description !== binder.description) changes.description = values.description;
  if (values.visibility !== binder.visibility) changes.visibility = values.visibility;
  return changes;
}

/** Rename a binder, change its description or who can see it. */
export function BinderDetailsEditor({ binder, onDone }: { binder: BinderSummary; onDone: () => void }) {
  const update = useUpdateBinder(binder.id);
  return (
    <BinderForm
      autoFocus
      defaultValues={{ name: binder.name, description: binder.description, visibility: binder.visibility }}
      submitLabel="Save changes"
      busyLabel="Saving…"
      onCancel={onDone}
      onSubmit={async (values) => {
        const changes = binderChanges(binder, values);
        if (Object.keys(changes).length > 0) {
          await update.mutateAsync(changes);
          toast.success(`“${values.name}” is saved.`);
        }
        onDone();
      }}
    />
  );
}
