import { useEffect, useId, useRef, useState } from "react";
import { inkTypes, type Brand, type InkType } from "../../../../shared/schemas/inks";
import { Button } from "../../../components/ui/button";
import { controlClasses, SelectInput } from "../../../components/ui/field";
import { capitalise } from "../../../lib/format";
import { hasActiveFilters, type DiscontinuedChoice, type InkFilters } from "../ink-filters";

type InkFiltersFormProps = {
  filters: InkFilters;
  brands: Brand[] | undefined;
  brandsFailed?: boolean;
  onChange: (changes: Partial<InkFilters>) => void;
  onClear: () => void;
};

const discontinuedLabels: Record<DiscontinuedChoice, string> = {
  include: "Included",
  exclude: "Left out",
  only: "Only these",
};

const SEARCH_DELAY_MS = 350;

/** Search box and filters. Every change goes to the URL, so a search can be shared as a link. */
export function InkFiltersForm({ filters, brands, brandsFailed, onChange, onClear }: InkFiltersFormProps) {
  const id = useId();
  const [text, setText] = useState(filters.q ?? "");
  const lastSent = useRef(filters.q ?? "");

  // Back/forward or a cleared filter changes the URL under us: follow it.
  useEffect(() => {
    const q = filters.q ?? "";
    if (q !== lastSent.current) {
      lastSent.current = q;
      setText(q);
    }
  }, [filters.q]);

  useEffect(() => {
    const trimmed = text.trim();
    if (trimmed === lastSent.current) return;
    const timer = window.setTimeout(() => {
      lastSent.current = trimmed;
      onChange({ q: trimmed || undefined, page: 1 });
    }, SEARCH_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [text, onChange]);

  const labelClasses = "mb-1.5 block text-sm font-bold text-ink-soft";

  return (
    <form
      role="search"
      aria-label="Search the ink catalogue"
      className="grid gap-4 rounded-xl border border-rule bg-card p-4 shadow-card sm:grid-cols-2 lg:grid-cols-[2fr_1fr_1fr_1fr]"
      onSubmit={(e) => {
        e.preventDefault();
        const trimmed = text.trim();
        lastSent.current = trimmed;
        onChange({ q: trimmed || undefined, page: 1 });
      }}
    >
      <div className="sm:col-span-2 lg:col-span-1">
        <label htmlFor={`${id}-q`} className={labelClasses}>
          Search inks
        </label>
        <input
          id={`${id}-q`}
          type="search"
          name="q"
          value={text}
          maxLength={100}
          onChange={(e) => setText(e.target.value)}
          placeholder="Ink name, e.g. harbour"
          autoComplete="off"
          enterKeyHint="search"
          className={controlClasses}
        />
      </div>
      <div>
        <label htmlFor={`${id}-brand`} className={labelClasses}>
          Brand
        </label>
        <SelectInput
          id={`${id}-brand`}
          value={filters.brand ?? ""}
          onChange={(e) => onChange({ brand: e.target.value || undefined, page: 1 })}
          aria-describedby={brandsFailed ? `${id}-brand-note` : undefined}
        >
          <option value="">All brands</option>
          {brands?.map((b) => (
            <option key={b.slug} value={b.slug}>
              {b.name}
            </option>
          ))}
          {/* A shared link may name a brand before the list has loaded. */}
          {filters.brand && !brands?.some((b) => b.slug === filters.brand) && (
            <option value={filters.brand}>{filters.brand}</option>
          )}
        </SelectInput>
        {brandsFailed && (
          <p id={`${id}-brand-note`} className="mt-1 text-sm text-danger">
            Brands could not be loaded.
          </p>
        )}
      </div>
      <div>
        <label htmlFor={`${id}-type`} className={labelClasses}>
          Ink type
        </label>
        <SelectInput
          id={`${id}-type`}
          value={filters.type ?? ""}
          onChange={(e) => onChange({ type: (e.target.value || undefined) as InkType | undefined, page: 1 })}
        >
          <option value="">All types</option>
          {inkTypes.map((t) => (
            <option key={t} value={t}>
              {capitalise(t)}
            </option>
          ))}
        </SelectInput>
      </div>
      <div>
        <label htmlFor={`${id}-disc`} className={labelClasses}>
          Discontinued inks
        </label>
        <SelectInput
          id={`${id}-disc`}
          value={filters.discontinued}
          onChange={(e) => onChange({ discontinued: e.target.value as DiscontinuedChoice, page: 1 })}
        >
          {(Object.keys(discontinuedLabels) as DiscontinuedChoice[]).map((d) => (
            <option key={d} value={d}>
              {discontinuedLabels[d]}
            </option>
          ))}
        </SelectInput>
      </div>
      <div className="flex flex-wrap gap-2 sm:col-span-2 lg:col-span-4">
        <Button type="submit" variant="secondary">
          Search
        </Button>
        {hasActiveFilters(filters) && (
          <Button
            type="button"
            variant="quiet"
            onClick={() => {
              lastSent.current = "";
              setText("");
              onClear();
            }}
          >
            Clear search and filters
          </Button>
        )}
      </div>
    </form>
  );
}
