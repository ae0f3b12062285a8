import { useQuery } from "@tanstack/react-query";
import { useCallback, useMemo, type ReactNode } from "react";
import { Link, useLocation, useSearchParams } from "react-router";
import { MAX_SEARCH_COLOURS, MAX_SEARCH_INKS, type StripSearchResult } from "../../../shared/schemas/search";
import { Button } from "../../components/ui/button";
import { LoadMoreButton } from "../../components/ui/load-more-button";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { SaveToBinderButton } from "../../features/binders/components/save-to-binder-button";
import { useBrands } from "../../features/inks/api/get-brands";
import { useInksById } from "../../features/inks/api/get-inks-by-id";
import { InkPicker } from "../../features/inks/components/ink-picker";
import { LookAlikeSwaps } from "../../features/inks/components/look-alike-swaps";
import { useSearchStrips } from "../../features/search/api/search-strips";
import { ChosenColours } from "../../features/search/components/chosen-colours";
import { ChosenInks } from "../../features/search/components/chosen-inks";
import { ClosenessSlider } from "../../features/search/components/closeness-slider";
import { ColourChooser } from "../../features/search/components/colour-chooser";
import { InkPlacementChoice } from "../../features/search/components/ink-placement-choice";
import { NoResults } from "../../features/search/components/no-results";
import { SearchSortSwitch } from "../../features/search/components/search-sort";
import { StashChoice } from "../../features/search/components/stash-choice";
import { StripFiltersFields } from "../../features/search/components/strip-filters-fields";
import { effectiveSort, emptySearch, filterCount, loosenings, parseSearch, searchToParams, type SearchState } from "../../features/search/search-state";
import { stashQueryOptions } from "../../features/stash/api/get-stash";
import { StripList } from "../../features/strips/components/strip-list";
import { StripMatch } from "../../features/strips/components/strip-match";
import { errorMessage, isApiError, type ApiError } from "../../lib/api-client";
import { colourWords } from "../../lib/colour-words";
import { plural } from "../../lib/format";
import { hexToLab } from "../../../shared/colour";

/** The search without the inks and brands the server says the catalogue does not know. */
function withoutUnknown(search: SearchState, error: ApiError): SearchState {
  const named = (field: string) => new Set((error.fields?.[field] ?? []).flatMap((m) => m.replace(/^[^:]*:/, "").split(",")).map((v) => v.trim()));
  const inks = named("ink");
  const notInks = named("notInk");
  const brands = named("brand");
  return {
    ...search,
    ink: search.ink.filter((id) => !inks.has(String(id))),
    notInk: search.notInk.filter((id) => !notInks.has(String(id))),
    brand: search.brand.filter((slug) => !brands.has(slug)),
  };
}

function FilterSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="flex flex-col gap-3 border-b border-rule pb-5 last:border-b-0">
      <h2 className="text-lg font-bold">{title}</h2>
      {children}
    </section>
  );
}

export default function SearchPage() {
  const [params, setParams] = useSearchParams();
  const search = useMemo(() => parseSearch(params), [params]);
  const location = useLocation();
  const { data: me, isPending: meLoading } = useMe();
  const stash = useQuery({ ...stashQueryOptions(), enabled: !!me });
  const stashIds = useMemo(() => new Set((stash.data ?? []).map((i) => i.ink.id)), [stash.data]);
  const brands = useBrands();
  const inks = useInksById([...search.ink, ...search.notInk]);
  const needsSignIn = !!search.stash && !me;
  const results = useSearchStrips(search, me?.id ?? null, !needsSignIn);

  const go = useCallback(
    (next: SearchState, replace = false) => setParams(searchToParams(next), { replace, preventScrollReset: true }),
    [setParams],
  );
  const commitCloseness = useCallback((maxDeltaE: number) => go({ ...parseSearch(params), maxDeltaE }, true), [go, params]);

  const signInHref = `/sign-in?next=${encodeURIComponent(`${location.pathname}${location.search}`)}`;
  const count = filterCount(search);
  const sort = effectiveSort(search);
  const inkName = (id: number) => inks.get(id)?.name ?? `ink #${id}`;
  const brandName = (slug: string) => brands.data?.find((b) => b.slug === slug)?.name ?? slug;
  const chosenIds = [...search.ink, ...search.notInk];

  const items: StripSearchResult[] = results.data?.pages.flatMap((p) => p.items) ?? [];
  const total = results.data?.pages[0]?.total;

  let summary = "";
  let shortCount = "";
  if (results.data) {
    const n = total ?? items.length;
    const more = total === undefined && results.hasNextPage;
    const what = more ? `${items.length}+ strips` : n === 0 ? "No strips" : plural(n, "strip");
    shortCount = ` (${more ? `${items.length}+` : n})`;
    const order = sort === "closest" ? "closest colour first" : sort === "saves" ? "most saved first" : "newest first";
    summary = count === 0 ? `All ${what}, ${order}. Choose inks or colours to narrow them.` : `${what} found, ${order}.`;
  }

  return (
    <>
      <PageHeader
        documentTitle={count ? `Find combinations (${count} ${count === 1 ? "filter" : "filters"})` : "Find combinations"}
        title="Find combinations"
        intro="Search published strips by their inks, by a colour, or by the inks you own. Every filter must hold at once, and the address keeps the search so you can share it."
      />
      <div className="grid items-start gap-8 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <aside aria-label="Search filters" className="flex flex-col gap-5 rounded-xl border border-rule bg-card p-4 shadow-card">
          <a href="#search-results" className="self-start font-bold text-accent hover:underline lg:hidden">
            Skip to the results{shortCount}
          </a>
          <FilterSection title="Inks">
            <InkPicker
              label="Must include"
              hint="Strips with every ink you add here."
              chosenIds={chosenIds}
              stashInkIds={stashIds}
              disabled={search.ink.length >= MAX_SEARCH_INKS}
              onPick={(ink) => go({ ...search, ink: [...search.ink, ink.id] })}
            />
            <ChosenInks
              ids={search.ink}
              inks={inks}
              label="Inks the strip must include"
              onRemove={(id) => go({ ...search, ink: search.ink.filter((x) => x !== id) })}
              extra={(ink) => (
                <LookAlikeSwaps
                  ink={ink}
                  viewer={meLoading ? undefined : (me ?? null)}
                  exclude={chosenIds}
                  onSwap={(other) => go({ ...search, ink: search.ink.map((x) => (x === ink.id ? other.id : x)) })}
                />
              )}
            />
            {search.ink.length === 2 && <InkPlacementChoice adjacent={!!search.adjacent} onChange={(adjacent) => go({ ...search, adjacent: adjacent || undefined })} />}
            <InkPicker
              label="Leave out"
              hint="No strip with these inks."
              chosenIds={chosenIds}
              disabled={search.notInk.length >= MAX_SEARCH_INKS}
              onPick={(ink) => go({ ...search, notInk: [...search.notInk, ink.id] })}
            />
            <ChosenInks
              ids={search.notInk}
              inks={inks}
              excluded
              label="Inks left out"
              onRemove={(id) => go({ ...search, notInk: search.notInk.filter((x) => x !== id) })}
            />
          </FilterSection>

          <FilterSection title="Colours">
            <p className="text-sm text-ink-soft">
              Strips with a band close to each colour. Several colours must all be found in the same strip.
            </p>
            <ChosenColours colours={search.color} onRemove={(hex) => go({ ...search, color: search.color.filter((c) => c !== hex) })} />
            <ColourChooser
              chosen={search.color}
              full={search.color.length >= MAX_SEARCH_COLOURS ? `A search takes up to ${MAX_SEARCH_COLOURS} colours.` : undefined}
              onAdd={(hex) => go({ ...search, color: [...search.color, hex] })}
            />
            {search.color.length > 0 && <ClosenessSlider value={search.maxDeltaE} onCommit={commitCloseness} />}
            <p className="text-sm text-ink-muted">
              Tip: on any strip page you can tap its photo to search for the colour you tapped. Screens show colours a
              little differently from ink on paper.
            </p>
          </FilterSection>

          <FilterSection title="By your stash">
            <StashChoice value={search.stash} signedIn={!!me} signInHref={signInHref} onChange={(stashMode) => go({ ...search, stash: stashMode })} />
            {me && stash.data && stash.data.length === 0 && (
              <p className="text-sm text-ink-soft">
                Your stash is empty.{" "}
                <Link to="/stash" className="font-bold text-accent hover:underline">
                  Add the inks you own
                </Link>{" "}
                first.
              </p>
            )}
          </FilterSection>

          <FilterSection title="The strip">
            <StripFiltersFields search={search} brands={brands.data ?? []} onChange={(next) => go(next)} />
          </FilterSection>

          {count > 0 && (
            <Button variant="secondary" onClick={() => go(emptySearch)}>
              Clear all filters
            </Button>
          )}
        </aside>

        <section id="search-results" aria-labelledby="results-title" className="flex min-w-0 flex-col gap-5">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <div>
              <h2 id="results-title" className="text-xl font-bold">
                Results
              </h2>
              <p role="status" className="text-ink-soft" data-testid="result-summary">
                {results.isFetching && !results.isFetchingNextPage ? "Searching…" : summary}
              </p>
            </div>
            <SearchSortSwitch value={sort} hasColour={search.color.length > 0} onChange={(next) => go({ ...search, sort: next })} />
          </div>

          {needsSignIn ? (
            <Notice tone="info" title="Sign in to search by your stash">
              <p>
                Searching by the inks you own needs your stash.{" "}
                <Link to={signInHref} className="font-bold text-accent hover:underline">
                  Sign in
                </Link>{" "}
                or{" "}
                <button type="button" className="font-bold text-accent hover:underline" onClick={() => go({ ...search, stash: undefined })}>
                  search without it
                </button>
                .
              </p>
            </Notice>
          ) : results.isPending ? (
            <Loading label="Searching strips…" />
          ) : results.isLoadingError ? (
            <Notice tone="error" title="The search could not be run" live>
              <p>{errorMessage(results.error)}</p>
              <div className="mt-3 flex flex-wrap gap-2">
                {isApiError(results.error) && results.error.code === "unknown_filters" ? (
                  <Button variant="secondary" onClick={() => go(withoutUnknown(search, results.error as ApiError))}>
                    Leave those out and search
                  </Button>
                ) : (
                  <Button variant="secondary" onClick={() => void results.refetch()}>
                    Try again
                  </Button>
                )}
                <Button variant="quiet" onClick={() => go(emptySearch)}>
                  Start a new search
                </Button>
              </div>
            </Notice>
          ) : items.length === 0 ? (
            count === 0 ? (
              <p className="text-ink-soft">No strips are published yet.</p>
            ) : (
              <NoResults loosenings={loosenings(search, { ink: inkName, brand: brandName, colour: (hex) => colourWords(hexToLab(hex)) })} onApply={(next) => go(next)} onClear={() => go(emptySearch)} />
            )
          ) : (
            <div className="flex flex-col gap-6" aria-busy={results.isFetching}>
              <StripList
                strips={items}
                label="Search results"
                eagerCount={2}
                actions={(strip) => <SaveToBinderButton stripId={strip.id} />}
                details={(strip) => <StripMatch strip={strip} matches={strip.match} missingInkId={strip.missingInkId} ownedLookAlike={strip.ownedLookAlike} />}
              />
              {results.isError && (
                <Notice tone="error" title="More strips could not be loaded" live>
                  <p>{errorMessage(results.error)}</p>
                </Notice>
              )}
              {results.hasNextPage && <LoadMoreButton busy={results.isFetchingNextPage} onClick={() => void results.fetchNextPage()} />}
            </div>
          )}
        </section>
      </div>
    </>
  );
}
