import { useEffect, useRef, useState } from "react";
import { Link } from "react-router";
import type { Binder } from "../../../../shared/schemas/binders";
import { Button, ButtonLink, buttonClasses } from "../../../components/ui/button";
import { Card } from "../../../components/ui/card";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { DocumentTitle } from "../../../components/ui/page-header";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { formatDate, plural } from "../../../lib/format";
import { useBinder } from "../api/get-binder";
import { BinderCover } from "./binder-cover";
import { BinderDetailsEditor } from "./binder-details-editor";
import { BINDER_TITLE_ID, BinderItemList } from "./binder-item-list";
import { CopyLinkButton } from "./copy-link-button";
import { DeleteBinderButton } from "./delete-binder-button";
import { VisibilityBadge } from "./visibility-badge";

type BinderDetailProps = {
  binderId: number;
  /** After the owner deletes the binder (the page usually goes to the list of binders). */
  onDeleted?: () => void;
};

/** The same answer for a private binder and a missing one, so nobody learns which it is. */
export function BinderUnavailable() {
  return (
    <div className="mx-auto max-w-xl space-y-5 py-8 text-center">
      <DocumentTitle title="Binder not found" />
      <div aria-hidden="true" className="mx-auto h-3 w-40 rounded-full bg-rule" />
      <h1 className="text-3xl font-bold">This binder is private or does not exist</h1>
      <p className="text-lg text-ink-soft">
        Its owner may keep it to themselves, may have deleted it, or the link may be mistyped. If it is yours, sign in with
        the account that made it.
      </p>
      <div className="flex flex-wrap justify-center gap-3">
        <ButtonLink to="/gallery">Go to the gallery</ButtonLink>
        <ButtonLink to="/binders" variant="secondary">
          Your binders
        </ButtonLink>
      </div>
    </div>
  );
}

function BinderHeader({ binder, onDeleted }: { binder: Binder; onDeleted?: () => void }) {
  const [editing, setEditing] = useState(false);
  const editButton = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);

  useEffect(() => {
    if (editing || !returnFocus.current) return;
    returnFocus.current = false;
    editButton.current?.focus();
  }, [editing]);

  return (
    <header className="flex flex-col gap-4 border-b border-rule pb-6">
      <BinderCover cover={binder.cover} showWords={false} className="max-w-md" />
      <div className="flex flex-col gap-4 sm:flex-row sm:items-end sm:justify-between">
        <div className="min-w-0 space-y-2">
          <p className="text-sm font-bold tracking-wide text-ink-muted uppercase">{binder.isOwner ? "Your binder" : "Binder"}</p>
          <h1 id={BINDER_TITLE_ID} tabIndex={-1} className="text-3xl leading-tight font-bold break-words text-balance sm:text-4xl">
            {binder.name}
          </h1>
          <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-ink-soft">
            <VisibilityBadge visibility={binder.visibility} />
            <span>{plural(binder.itemCount, "strip")}</span>
            <span aria-hidden="true">·</span>
            <span>
              by{" "}
              <Link to={`/members/${binder.owner.id}`} className="font-bold text-accent hover:underline">
                {binder.owner.name}
              </Link>
            </span>
            <span aria-hidden="true">·</span>
            <span>
              changed <time dateTime={binder.updatedAt}>{formatDate(binder.updatedAt)}</time>
            </span>
          </p>
          {binder.description && <p className="max-w-prose whitespace-pre-line break-words text-lg text-ink-soft">{binder.description}</p>}
        </div>
        <div className="flex flex-wrap items-start gap-2">
          {binder.visibility === "public" && <CopyLinkButton path={`/binders/${binder.id}`} />}
          {binder.isOwner && !editing && (
            <>
              <button ref={editButton} type="button" className={buttonClasses("secondary")} onClick={() => setEditing(true)}>
                Edit details
              </button>
              <DeleteBinderButton binder={binder} onDeleted={onDeleted} />
            </>
          )}
        </div>
      </div>
      {binder.isOwner && binder.visibility === "private" && !editing && (
        <Notice>Only you can see this binder. To share it, choose “Edit details” and make it public.</Notice>
      )}
      {editing && (
        <Card>
          <h2 className="mb-4 text-xl font-bold">Edit binder details</h2>
          <BinderDetailsEditor
            binder={binder}
            onDone={() => {
              returnFocus.current = true;
              setEditing(false);
            }}
          />
        </Card>
      )}
    </header>
  );
}

/** A binder's page: who made it, who can see it, and its strips in order. */
export function BinderDetail({ binderId, onDeleted }: BinderDetailProps) {
  const binder = useBinder(binderId);

  if (binder.isPending) return <Loading label="Opening the binder…" />;
  if (binder.isError) {
    if (isApiError(binder.error) && binder.error.status === 404) return <BinderUnavailable />;
    return (
      <>
        <DocumentTitle title="Binder" />
        <Notice tone="error" title="This binder could not be loaded" live>
          <p>{errorMessage(binder.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void binder.refetch()}>
            Try again
          </Button>
        </Notice>
      </>
    );
  }

  const data = binder.data;
  return (
    <article aria-labelledby={BINDER_TITLE_ID} className="flex flex-col gap-8">
      <DocumentTitle title={data.name} />
      {data.isOwner && (
        <nav aria-label="Breadcrumb">
          <Link to="/binders" className="inline-flex min-h-11 items-center font-bold text-accent hover:underline">
            <span aria-hidden="true">←</span>&nbsp;Your binders
          </Link>
        </nav>
      )}
      <BinderHeader binder={data} onDeleted={onDeleted} />
      <section aria-label="Strips" className="flex flex-col gap-4">
        {data.items.length === 0 ? (
          <Notice title="No strips in this binder yet">
            {data.isOwner ? (
              <p>
                Use “Save” on any strip in the <Link to="/gallery">gallery</Link> and choose “{data.name}”.
              </p>
            ) : (
              <p>Its owner has not saved any strips to it yet.</p>
            )}
          </Notice>
        ) : (
          <BinderItemList binder={data} />
        )}
      </section>
    </article>
  );
}
