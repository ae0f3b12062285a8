import { useId, useState } from "react";
import type { Brand } from "../../../../shared/schemas/inks";
import { brandInput } from "../../../../shared/schemas/inks";
import { Button } from "../../../components/ui/button";
import { controlClasses, fieldErrorText } from "../../../components/ui/field";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { useCreateBrand } from "../api/create-brand";

/**
 * A small "add brand" row for the ink form. Not a <form> of its own, because it sits inside the
 * ink form and forms cannot nest; Enter in its box adds the brand instead of saving the ink.
 */
export function BrandQuickAdd({ onAdded }: { onAdded: (brand: Brand) => void }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const createBrand = useCreateBrand();

  async function add() {
    const parsed = brandInput.safeParse({ name });
    if (!parsed.success) {
      setProblem(fieldErrorText("Brand name", parsed.error.issues[0]?.message ?? "is not valid"));
      return;
    }
    setProblem(null);
    try {
      const brand = await createBrand.mutateAsync(parsed.data.name);
      onAdded(brand);
      setName("");
      setOpen(false);
    } catch (error) {
      const fieldText = isApiError(error) ? error.fields?.name?.join(" ") : undefined;
      setProblem(fieldText ? fieldErrorText("Brand name", fieldText) : errorMessage(error));
    }
  }

  if (!open) {
    return (
      <Button variant="quiet" className="self-start px-2" onClick={() => setOpen(true)} aria-expanded={false}>
        + Add a brand that is not listed
      </Button>
    );
  }

  return (
    <div role="group" aria-label="Add a brand" className="rounded-lg border border-dashed border-rule-strong bg-paper p-3">
      <label htmlFor={`${id}-name`} className="mb-1.5 block font-bold">
        New brand name
      </label>
      <div className="flex flex-wrap gap-2">
        <input
          id={`${id}-name`}
          value={name}
          maxLength={60}
          autoFocus
          onChange={(e) => setName(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === "Enter") {
              e.preventDefault();
              void add();
            } else if (e.key === "Escape") {
              setOpen(false);
            }
          }}
          aria-invalid={problem ? true : undefined}
          aria-describedby={problem ? `${id}-problem` : undefined}
          className={`${controlClasses} flex-1 basis-48`}
        />
        <Button variant="secondary" busy={createBrand.isPending} onClick={() => void add()}>
          Add brand
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      {problem && (
        <p id={`${id}-problem`} role="alert" className="mt-1.5 text-sm font-bold text-danger">
          {problem}
        </p>
      )}
    </div>
  );
}
