import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Link, useNavigate, useParams } from "react-router";
import type { Strip } from "../../../shared/schemas/strips";
import { Button } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { DocumentTitle } from "../../components/ui/page-header";
import { toast } from "../../components/ui/toast";
import { useMe } from "../../features/accounts/api/get-me";
import { InkPicker } from "../../features/inks/components/ink-picker";
import { SaveToBinderButton } from "../../features/binders/components/save-to-binder-button";
import { ReportStripButton } from "../../features/review/components/report-strip-button";
import { useRelatedStrips } from "../../features/strips/api/get-related-strips";
import { useStrip } from "../../features/strips/api/get-strip";
import { stripKeys } from "../../features/strips/api/keys";
import { BandBar } from "../../features/strips/components/band-bar";
import { BandColourLinks } from "../../features/strips/components/band-colour-links";
import { BandComparison } from "../../features/strips/components/band-comparison";
import { DeleteStripButton } from "../../features/strips/components/delete-strip-button";
import { EditStripForm } from "../../features/strips/components/edit-strip-form";
import { PhotoColourPicker } from "../../features/strips/components/photo-colour-picker";
import { StripFacts } from "../../features/strips/components/strip-facts";
import { StripInkOrder } from "../../features/strips/components/strip-ink-order";
import { StripList } from "../../features/strips/components/strip-list";
import { StripNotes } from "../../features/strips/components/strip-notes";
import { StripStatusBadge, StripStatusBanner } from "../../features/strips/components/strip-status";
import { uprightSrcSet } from "../../features/strips/image-sources";
import type { InkPickerSlot } from "../../features/strips/ink-choice";
import { directionWords, stripAltFor } from "../../features/strips/strip-words";
import { errorMessage, isApiError } from "../../lib/api-client";
import { formatDate, plural } from "../../lib/format";
import NotFoundPage from "./not-found";

function parseId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,15}$/.test(raw)) return null;
  const id = Number(raw);
  return Number.isSafeInteger(id) ? id : null;
}

export default function StripPage() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFoundPage what="strip" />;
  return <StripDetail key={id} id={id} />;
}

const picker: InkPickerSlot = ({ onPick, chosenIds, disabled }) => (
  <InkPicker
    chosenIds={chosenIds}
    disabled={disabled}
    hint="Type part of an ink's name. It is added at the end; move it into place."
    onPick={(ink) => onPick({ id: ink.id, name: ink.name, brand: ink.brand.name, hex: ink.hex, lab: ink.lab })}
  />
);

function RelatedStrips({ id }: { id: number }) {
  const related = useRelatedStrips(id);
  return (
    <section aria-labelledby="related-title" className="flex flex-col gap-4">
      <h2 id="related-title" className="border-b border-rule pb-2 text-2xl font-bold">
        More strips with these inks
      </h2>
      {related.isPending ? (
        <Loading label="Looking for strips with these inks…" />
      ) : related.isError ? (
        <Notice tone="error" title="Related strips could not be loaded">
          <p>{errorMessage(related.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void related.refetch()}>
            Try again
          </Button>
        </Notice>
      ) : related.data.length === 0 ? (
        <p className="text-ink-soft">No other strips share these inks yet.</p>
      ) : (
        <StripList strips={related.data} label="More strips with these inks" />
      )}
    </section>
  );
}

function StripView({ strip, isAuthor, signedIn, onEdit }: { strip: Strip; isAuthor: boolean; signedIn: boolean; onEdit: () => void }) {
  const navigate = useNavigate();
  const date = strip.publishedAt ?? strip.createdAt;
  const { width, height } = strip.images;
  const srcSet = width && height ? uprightSrcSet(strip.images, width / height, Math.max(width, height)) : undefined;
  return (
    <>
      <figure className="flex flex-col gap-3 rounded-xl border border-rule bg-card p-2.5 shadow-card sm:p-4">
        <PhotoColourPicker
          photo={{
            src: strip.images.display,
            srcSet,
            sizes: "(min-width: 66rem) 62rem, calc(100vw - 2rem)",
            alt: stripAltFor(strip),
            placeholder: strip.images.placeholder,
            width: strip.images.width || undefined,
            height: strip.images.height || undefined,
            footer: strip.orientation === "horizontal" && <BandBar bands={strip.bands} orientation={strip.orientation} />,
          }}
        >
          {strip.orientation === "vertical" && <BandBar bands={strip.bands} orientation={strip.orientation} />}
        </PhotoColourPicker>
      </figure>

      {isAuthor && (
        <div className="flex flex-wrap gap-3">
          {strip.status !== "hidden" && strip.status !== "rejected" && (
            <Button variant="secondary" onClick={onEdit}>
              Edit
            </Button>
          )}
          <DeleteStripButton
            stripId={strip.id}
            title={strip.title}
            onDeleted={() => {
              toast.success(`“${strip.title}” is deleted.`);
              void navigate(`/members/${strip.author.id}`);
            }}
          />
        </div>
      )}

      {strip.status === "published" && (
        <div className="flex flex-wrap items-start gap-3">
          <SaveToBinderButton stripId={strip.id} saves={strip.saves} />
          {!isAuthor && signedIn && <ReportStripButton stripId={strip.id} />}
        </div>
      )}

      <div className="grid gap-10 md:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <section aria-labelledby="ink-order-title" className="flex flex-col gap-3">
          <h2 id="ink-order-title" className="text-2xl font-bold">
            Ink order
          </h2>
          <StripInkOrder inks={strip.inks} />
        </section>
        <div className="flex flex-col gap-4">
          <section aria-labelledby="facts-title" className="flex flex-col gap-3">
            <h2 id="facts-title" className="text-2xl font-bold">
              Paper and tools
            </h2>
            <StripFacts strip={strip} />
          </section>
          <p className="text-ink-soft">
            Posted by{" "}
            <Link to={`/members/${strip.author.id}`} className="font-bold text-accent underline">
              {strip.author.name}
            </Link>{" "}
            on <time dateTime={date}>{formatDate(date)}</time> · {plural(strip.saves, "save")}
          </p>
        </div>
      </div>

      <section aria-labelledby="bands-title" className="flex flex-col gap-3">
        <h2 id="bands-title" className="text-2xl font-bold">
          Bands
        </h2>
        <p className="max-w-prose text-ink-soft">
          {plural(strip.bands.length, "band")}, {directionWords(strip.orientation)}: each band's colour as measured on the
          photo beside its ink's reference colour. ΔE2000 says how far apart they are; up to 2 is barely different.
        </p>
        <BandComparison strip={strip} />
        <BandColourLinks bands={strip.bands} />
      </section>

      <section aria-labelledby="notes-title" className="flex flex-col gap-3">
        <h2 id="notes-title" className="text-2xl font-bold">
          Notes
        </h2>
        <StripNotes html={strip.notes} />
      </section>
    </>
  );
}

function StripDetail({ id }: { id: number }) {
  const strip = useStrip(id);
  const { data: me } = useMe();
  const queryClient = useQueryClient();
  const [editing, setEditing] = useState(false);

  if (strip.isPending) return <Loading label="Loading the strip…" />;
  if (strip.isError) {
    if (isApiError(strip.error) && strip.error.status === 404) return <NotFoundPage what="strip" />;
    return (
      <>
        <DocumentTitle title="Strip" />
        <Notice tone="error" title="This strip could not be loaded" live>
          <p>{errorMessage(strip.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void strip.refetch()}>
            Try again
          </Button>
        </Notice>
      </>
    );
  }

  const data = strip.data;
  const isAuthor = me?.id === data.author.id;
  const date = data.publishedAt ?? data.createdAt;

  return (
    <article aria-labelledby="strip-title" className="flex flex-col gap-8">
      <DocumentTitle title={data.title} />
      <nav aria-label="Breadcrumb">
        <Link to="/gallery" className="inline-flex min-h-11 items-center font-bold text-accent hover:underline">
          <span aria-hidden="true">←</span>&nbsp;Gallery
        </Link>
      </nav>

      <header className="flex flex-col gap-2">
        {data.status !== "published" && (
          <p>
            <StripStatusBadge status={data.status} />
          </p>
        )}
        <h1 id="strip-title" className="text-3xl leading-tight font-bold text-balance sm:text-4xl">
          {data.title}
        </h1>
        <p className="text-lg text-ink-soft">
          by{" "}
          <Link to={`/members/${data.author.id}`} className="font-bold text-accent hover:underline">
            {data.author.name}
          </Link>{" "}
          · <time dateTime={date}>{formatDate(date)}</time>
        </p>
      </header>

      <StripStatusBanner strip={data} />

      {editing && me ? (
        <Card>
          <h2 className="mb-5 text-2xl font-bold">Edit your strip</h2>
          <EditStripForm
            strip={data}
            standing={me.standing}
            picker={picker}
            onDone={() => setEditing(false)}
            onReload={() => {
              setEditing(false);
              void queryClient.invalidateQueries({ queryKey: stripKeys.detail(id) });
            }}
          />
        </Card>
      ) : (
        <StripView strip={data} isAuthor={isAuthor} signedIn={!!me} onEdit={() => setEditing(true)} />
      )}

      <RelatedStrips id={id} />
    </article>
  );
}
