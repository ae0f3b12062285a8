import { useEffect, useRef, useState } from "react";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { Button, buttonClasses } from "../../../components/ui/button";
import { Card } from "../../../components/ui/card";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useCreateBinder } from "../api/create-binder";
import { useMyBinders } from "../api/get-my-binders";
import { BinderDetailsEditor } from "./binder-details-editor";
import { BinderForm } from "./binder-form";
import { BinderSummaryCard } from "./binder-summary-card";
import { DeleteBinderButton } from "./delete-binder-button";

const LIST_TITLE_ID = "my-binders-title";

function MyBinderItem({ binder }: { binder: BinderSummary }) {
  const [editing, setEditing] = useState(false);
  const editButton = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);

  // Closing the form puts keyboard focus back on the button that opened it.
  useEffect(() => {
    if (editing || !returnFocus.current) return;
    returnFocus.current = false;
    editButton.current?.focus();
  }, [editing]);

  return (
    <BinderSummaryCard
      binder={binder}
      actions={
        editing ? undefined : (
          <>
            <button ref={editButton} type="button" className={buttonClasses("secondary")} onClick={() => setEditing(true)}>
              Edit<span className="sr-only"> “{binder.name}”</span>
            </button>
            {/* The binder's row is gone afterwards: continue from the list's heading. */}
            <DeleteBinderButton
              binder={binder}
              onDeleted={() => window.setTimeout(() => document.getElementById(LIST_TITLE_ID)?.focus(), 0)}
            />
          </>
        )
      }
    >
      {editing && (
        <div className="border-t border-rule pt-4">
          <h4 className="mb-4 font-bold">Edit “{binder.name}”</h4>
          <BinderDetailsEditor
            binder={binder}
            onDone={() => {
              returnFocus.current = true;
              setEditing(false);
            }}
          />
        </div>
      )}
    </BinderSummaryCard>
  );
}

function NewBinderCard() {
  const create = useCreateBinder();
  const [formKey, setFormKey] = useState(0);
  return (
    <Card>
      <h2 className="mb-1 text-xl font-bold">Start a binder</h2>
      <p className="mb-5 text-ink-soft">Collect strips for a project, a season or an ink you love. You can add strips from the gallery.</p>
      <BinderForm
        key={formKey}
        submitLabel="Create binder"
        busyLabel="Creating…"
        onSubmit={async (values) => {
          const binder = await create.mutateAsync(values);
          toast.success(`“${binder.name}” is ready. Save strips to it with “Save” in the gallery.`);
          setFormKey((k) => k + 1);
        }}
      />
    </Card>
  );
}

/** The signed-in member's binders, with a form to start one and edit or delete each. */
export function MyBinders() {
  const binders = useMyBinders();

  let list;
  if (binders.isPending) list = <Loading label="Loading your binders…" />;
  else if (binders.isError)
    list = (
      <Notice tone="error" title="Your binders could not be loaded" live>
        <p>{errorMessage(binders.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void binders.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  else if (!binders.data || binders.data.length === 0)
    list = (
      <Notice title="No binders yet">
        <p>Start one with the form “Start a binder”. Then use “Save” on any strip in the gallery to add it.</p>
      </Notice>
    );
  else
    list = (
      <ul aria-label="Your binders" className="flex flex-col gap-4">
        {binders.data.map((b) => (
          <li key={b.id}>
            <MyBinderItem binder={b} />
          </li>
        ))}
      </ul>
    );

  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <section aria-labelledby={LIST_TITLE_ID} className="flex min-w-0 flex-col gap-4">
        <h2 id={LIST_TITLE_ID} tabIndex={-1} className="text-2xl font-bold">
          {binders.data ? `Your binders (${binders.data.length})` : "Your binders"}
        </h2>
        {binders.data && binders.data.length > 0 && (
          <p className="text-ink-soft">
            {plural(binders.data.filter((b) => b.visibility === "public").length, "public binder")} shown on your profile; private
            ones only you can see.
          </p>
        )}
        {list}
      </section>
      <div className="lg:sticky lg:top-24 lg:self-start">
        <NewBinderCard />
      </div>
    </div>
  );
}
