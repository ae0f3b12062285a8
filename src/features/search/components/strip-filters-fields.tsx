import type { Brand, InkType } from "../../../../shared/schemas/inks";
import { inkTypes } from "../../../../shared/schemas/inks";
import { MAX_SEARCH_INKS } from "../../../../shared/schemas/search";
import { paperLabels, papers } from "../../../../shared/schemas/strips";
import { Field, SelectInput } from "../../../components/ui/field";
import type { Paper, SearchState } from "../search-state";

const typeLabels: Record<InkType, string> = { dye: "Dye", pigment: "Pigment", hybrid: "Hybrid" };

type StripFiltersFieldsProps = {
  search: SearchState;
  brands: Brand[];
  onChange: (next: SearchState) => void;
};

/** Brand, ink type, number of inks and paper: each a plain select, "any" when unset. */
export function StripFiltersFields({ search, brands, onChange }: StripFiltersFieldsProps) {
  const brand = search.brand[0] ?? "";
  const knownBrand = !brand || brands.some((b) => b.slug === brand);
  return (
    <div className="grid grid-cols-1 gap-4 sm:grid-cols-2 lg:grid-cols-1">
      <Field label="Brand" hint="At least one ink of this brand.">
        {({ id, describedBy }) => (
          <SelectInput id={id} aria-describedby={describedBy} value={brand} onChange={(e) => onChange({ ...search, brand: e.target.value ? [e.target.value] : [] })}>
            <option value="">Any brand</option>
            {!knownBrand && <option value={brand}>{brand}</option>}
            {brands.map((b) => (
              <option key={b.id} value={b.slug}>
                {b.name}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>
      <Field label="Ink type" hint="At least one ink of this type.">
        {({ id, describedBy }) => (
          <SelectInput
            id={id}
            aria-describedby={describedBy}
            value={search.type ?? ""}
            onChange={(e) => onChange({ ...search, type: (e.target.value || undefined) as InkType | undefined })}
          >
            <option value="">Any type</option>
            {inkTypes.map((t) => (
              <option key={t} value={t}>
                {typeLabels[t]}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>
      <Field label="Number of inks">
        {({ id }) => (
          <SelectInput
            id={id}
            value={search.inkCount ?? ""}
            onChange={(e) => onChange({ ...search, inkCount: e.target.value ? Number(e.target.value) : undefined })}
          >
            <option value="">Any number</option>
            {Array.from({ length: MAX_SEARCH_INKS }, (_, i) => i + 1).map((n) => (
              <option key={n} value={n}>
                {n === 1 ? "1 ink" : `${n} inks`}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>
      <Field label="Paper">
        {({ id }) => (
          <SelectInput id={id} value={search.paper ?? ""} onChange={(e) => onChange({ ...search, paper: (e.target.value || undefined) as Paper | undefined })}>
            <option value="">Any paper</option>
            {papers.map((p) => (
              <option key={p} value={p}>
                {paperLabels[p]}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>
    </div>
  );
}
