import { useState } from "react";
import { InYourStashNote } from "../../features/stash/components/in-your-stash-note";
import { Link, useParams } from "react-router";
import { Button } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { DocumentTitle } from "../../components/ui/page-header";
import { toast } from "../../components/ui/toast";
import { useMe } from "../../features/accounts/api/get-me";
import { useBrands } from "../../features/inks/api/get-brands";
import { useInk } from "../../features/inks/api/get-ink";
import { useUpdateInk } from "../../features/inks/api/update-ink";
import { colourWords } from "../../features/inks/colour-words";
import { InkColourFacts } from "../../features/inks/components/ink-colour-facts";
import { InkForm } from "../../features/inks/components/ink-form";
import { LookAlikes } from "../../features/inks/components/look-alikes";
import { InkSwatch } from "../../features/inks/components/ink-swatch";
import { DiscontinuedBadge, InkTypeBadge } from "../../features/inks/components/ink-type-badge";
import { BlendedBeside } from "../../features/plan/components/blended-beside";
import { StripFeed } from "../../features/strips/components/strip-feed";
import { GALLERY_PAGE_SIZE } from "../../features/strips/strip-filters";
import type { Ink } from "../../../shared/schemas/inks";
import { errorMessage, isApiError } from "../../lib/api-client";
import { formatDate } from "../../lib/format";
import { canModerate } from "../../lib/roles";
import NotFoundPage from "./not-found";

function parseId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,15}$/.test(raw)) return null;
  const id = Number(raw);
  return Number.isSafeInteger(id) ? id : null;
}

function EditInk({ ink, onDone }: { ink: Ink; onDone: () => void }) {
  const brands = useBrands();
  const updateInk = useUpdateInk(ink.id);
  if (brands.isPending) return <Loading label="Loading brands…" />;
  if (brands.isError)
    return (
      <Notice tone="error" title="Brands could not be loaded" live>
        <p>{errorMessage(brands.error)}</p>
      </Notice>
    );
  return (
    <InkForm
      ink={ink}
      brands={brands.data}
      submitLabel="Save changes"
      busyLabel="Saving…"
      onCancel={onDone}
      onSubmit={async (_values, changes) => {
        const saved = await updateInk.mutateAsync(changes);
        toast.success(`${saved.name} is saved.`);
        onDone();
      }}
    />
  );
}

export default function InkPage() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFoundPage />;
  return <InkDetail id={id} />;
}

function InkDetail({ id }: { id: number }) {
  const ink = useInk(id);
  const meQuery = useMe();
  const me = meQuery.data;
  // Look-alikes wait until we know who is asking (a member's answer marks their own inks).
  const viewer = meQuery.isPending ? undefined : (me ?? null);
  const [editing, setEditing] = useState(false);

  if (ink.isPending) return <Loading label="Loading the ink…" />;
  if (ink.isError) {
    if (isApiError(ink.error) && ink.error.status === 404) return <NotFoundPage what="ink" />;
    return (
      <>
        <DocumentTitle title="Ink" />
        <Notice tone="error" title="This ink could not be loaded" live>
          <p>{errorMessage(ink.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void ink.refetch()}>
            Try again
          </Button>
        </Notice>
      </>
    );
  }

  const data = ink.data;
  const words = colourWords(data.lab);
  return (
    <article aria-labelledby="ink-title" className="flex flex-col gap-8">
      <DocumentTitle title={`${data.name} · ${data.brand.name}`} />
      <nav aria-label="Breadcrumb" className="text-ink-soft">
        <Link to="/inks" className="inline-flex min-h-11 items-center font-bold text-accent hover:underline">
          <span aria-hidden="true">←</span>&nbsp;Ink catalogue
        </Link>
      </nav>

      <div className="overflow-hidden rounded-xl border border-rule bg-card p-3 shadow-card sm:p-4">
        <InkSwatch hex={data.hex} className="h-36 w-full sm:h-48" />
      </div>

      <header className="flex flex-col gap-3 sm:flex-row sm:items-end sm:justify-between">
        <div className="space-y-2">
          <p className="text-lg text-ink-soft">{data.brand.name}</p>
          <h1 id="ink-title" className="text-3xl leading-tight font-bold sm:text-4xl">
            {data.name}
          </h1>
          <div className="flex flex-wrap items-center gap-2">
            <InkTypeBadge type={data.type} />
            {data.discontinued && <DiscontinuedBadge />}
            <span className="text-ink-soft">{words}</span>
            <InYourStashNote inkId={data.id} />
          </div>
        </div>
        {canModerate(me?.role) && !editing && (
          <Button variant="secondary" className="self-start sm:self-auto" onClick={() => setEditing(true)}>
            Edit ink
          </Button>
        )}
      </header>

      {data.discontinued && (
        <Notice tone="warning" title="Discontinued">
          The maker no longer sells this ink. It stays in the catalogue so older strips keep their names.
        </Notice>
      )}

      {editing ? (
        <Card>
          <h2 className="mb-5 text-2xl font-bold">Edit ink</h2>
          <EditInk ink={data} onDone={() => setEditing(false)} />
        </Card>
      ) : (
        <section aria-labelledby="ink-colour" className="space-y-3">
          <h2 id="ink-colour" className="text-xl font-bold">
            Reference colour
          </h2>
          <InkColourFacts ink={data} />
          <p className="text-sm text-ink-muted">
            CIELAB under D65 light. The screen swatch is the nearest sRGB colour; your screen and the ink on paper will
            differ a little. Updated {formatDate(data.updatedAt)}.
          </p>
        </section>
      )}

      <section aria-labelledby="ink-look-alikes" className="space-y-4">
        <h2 id="ink-look-alikes" className="border-b border-rule pb-2 text-2xl font-bold">
          Look-alikes
        </h2>
        <LookAlikes ink={data} viewer={viewer} />
      </section>

      <section aria-labelledby="ink-beside" className="space-y-4">
        <h2 id="ink-beside" className="border-b border-rule pb-2 text-2xl font-bold">
          Blended next to it
        </h2>
        <p className="text-ink-soft">The inks members most often blend straight into {data.name} in published strips.</p>
        <BlendedBeside inkId={data.id} inkName={data.name} />
      </section>

      <section aria-labelledby="ink-strips" className="space-y-4">
        <div className="flex flex-wrap items-end justify-between gap-x-4 gap-y-1 border-b border-rule pb-2">
          <h2 id="ink-strips" className="text-2xl font-bold">
            Strips with this ink
          </h2>
          <Link to={`/search?ink=${data.id}`} className="inline-flex min-h-11 items-center font-bold text-accent underline hover:text-accent-deep">
            Search strips with this ink
          </Link>
        </div>
        <StripFeed
          filters={{ sort: "newest", ink: data.id, limit: GALLERY_PAGE_SIZE }}
          label={`Strips with ${data.name}`}
          eagerCount={0}
          empty={<p className="text-ink-soft">No published strip uses {data.name} yet.</p>}
        />
      </section>
    </article>
  );
}
