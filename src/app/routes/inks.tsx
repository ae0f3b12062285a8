import { useCallback } from "react";
import { useSearchParams } from "react-router";
import { ButtonLink } from "../../components/ui/button";
import { Button } from "../../components/ui/button";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { Pagination } from "../../components/ui/pagination";
import { useMe } from "../../features/accounts/api/get-me";
import { useBrands } from "../../features/inks/api/get-brands";
import { useInks } from "../../features/inks/api/get-inks";
import { InkFiltersForm } from "../../features/inks/components/ink-filters-form";
import { InkList } from "../../features/inks/components/ink-list";
import {
  filtersFromSearchParams,
  filtersToSearchParams,
  hasActiveFilters,
  type InkFilters,
} from "../../features/inks/ink-filters";
import { errorMessage } from "../../lib/api-client";
import { plural } from "../../lib/format";
import { canModerate, isAdmin } from "../../lib/roles";

export default function InksPage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = filtersFromSearchParams(searchParams);
  const inks = useInks(filters);
  const brands = useBrands();
  const { data: me } = useMe();

  const updateFilters = useCallback(
    (changes: Partial<InkFilters>) => {
      setSearchParams(
        (prev) => filtersToSearchParams({ ...filtersFromSearchParams(prev), ...changes }),
        // Typing in the search box should not fill the back button with every letter.
        { replace: "q" in changes, preventScrollReset: true },
      );
    },
    [setSearchParams],
  );

  const hrefFor = (page: number) => {
    const qs = filtersToSearchParams({ ...filters, page }).toString();
    return qs ? `?${qs}` : "?";
  };

  const data = inks.data;
  const first = data ? (data.page - 1) * data.pageSize + 1 : 0;
  const last = data ? first + data.items.length - 1 : 0;

  return (
    <>
      <PageHeader
        documentTitle={filters.q ? `Inks matching “${filters.q}”` : "Ink catalogue"}
        title="Ink catalogue"
        intro="Every ink's reference colour as measured on white cardstock, in words and numbers as well as on screen."
        actions={
          canModerate(me?.role) ? (
            <>
              <ButtonLink to="/inks/new">New ink</ButtonLink>
              {isAdmin(me?.role) && (
                <ButtonLink to="/inks/import" variant="secondary">
                  Import catalogue
                </ButtonLink>
              )}
            </>
          ) : undefined
        }
      />

      <InkFiltersForm
        filters={filters}
        brands={brands.data}
        brandsFailed={brands.isError}
        onChange={updateFilters}
        onClear={() => setSearchParams(new URLSearchParams())}
      />

      <section aria-labelledby="ink-results" aria-busy={inks.isFetching} className="mt-8">
        <h2 id="ink-results" className="sr-only">
          Results
        </h2>
        <p role="status" className="mb-4 min-h-6 text-ink-soft">
          {data &&
            (data.total === 0
              ? ""
              : `${plural(data.total, "ink")}${data.total > data.items.length ? `, showing ${first}–${last}` : ""}`)}
          {inks.isFetching && data ? " · updating…" : ""}
        </p>

        {inks.isPending ? (
          <Loading label="Loading inks…" />
        ) : inks.isError ? (
          <Notice tone="error" title="The inks could not be loaded" live>
            <p>{errorMessage(inks.error)}</p>
            <Button variant="secondary" className="mt-3" onClick={() => void inks.refetch()}>
              Try again
            </Button>
          </Notice>
        ) : inks.data.items.length === 0 ? (
          <Notice title={hasActiveFilters(filters) ? "No inks match this search" : "The catalogue is empty"}>
            {hasActiveFilters(filters) ? (
              <p>Try fewer words, another brand, or include discontinued inks.</p>
            ) : (
              <p>Inks appear here once a moderator adds them.</p>
            )}
          </Notice>
        ) : (
          <div className={inks.isPlaceholderData ? "opacity-60 transition-opacity" : "transition-opacity"}>
            <InkList inks={inks.data.items} label="Inks" />
            <Pagination page={inks.data.page} pageSize={inks.data.pageSize} total={inks.data.total} hrefFor={hrefFor} label="Ink pages" />
          </div>
        )}
      </section>
    </>
  );
}
