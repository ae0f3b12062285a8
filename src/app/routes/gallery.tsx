import { useSearchParams } from "react-router";
import { SaveToBinderButton } from "../../features/binders/components/save-to-binder-button";
import { ButtonLink } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { SortSwitch } from "../../features/strips/components/sort-switch";
import { StripFeed } from "../../features/strips/components/strip-feed";
import { GALLERY_PAGE_SIZE, sortFromSearchParams } from "../../features/strips/strip-filters";

export default function GalleryPage() {
  const [params, setParams] = useSearchParams();
  const sort = sortFromSearchParams(params);
  const { data: me } = useMe();

  return (
    <>
      <PageHeader
        documentTitle={sort === "saves" ? "Gallery, most saved" : "Gallery"}
        title="Gallery"
        intro="Blended strips from the community, each with its inks in order. Colours are given in words and numbers too."
        actions={
          <ButtonLink to="/search" variant="secondary">
            Search by ink or colour
          </ButtonLink>
        }
      />
      <div className="mb-6 flex flex-wrap items-center justify-between gap-3">
        <h2 className="text-xl font-bold">{sort === "saves" ? "Most saved strips" : "Newest strips"}</h2>
        <SortSwitch
          value={sort}
          onChange={(next) => setParams(next === "newest" ? {} : { sort: next }, { replace: true, preventScrollReset: true })}
        />
      </div>
      <StripFeed
        filters={{ sort, limit: GALLERY_PAGE_SIZE }}
        label={sort === "saves" ? "Most saved strips" : "Newest strips"}
        actions={(strip) => <SaveToBinderButton stripId={strip.id} />}
        empty={
          <div className="rounded-xl border-2 border-dashed border-rule-strong bg-card/60 px-5 py-10 text-center">
            <p className="text-xl font-bold">No strips yet</p>
            <p className="mx-auto mt-2 max-w-prose text-ink-soft">
              The gallery fills up as members post their dried strips.{me ? " Yours could be the first." : ""}
            </p>
            {me && (
              <ButtonLink to="/post" className="mt-4">
                Post a strip
              </ButtonLink>
            )}
          </div>
        }
      />
    </>
  );
}
