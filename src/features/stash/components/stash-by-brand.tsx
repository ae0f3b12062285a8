import type { StashItem } from "../../../../shared/schemas/stash";
import { plural } from "../../../lib/format";
import { groupByBrand } from "../import-plan";
import { StashInkCard } from "./stash-ink-card";

/** The stash as swatches, one group per brand (brand, then ink name, as the server sorts them). */
export function StashByBrand({ items }: { items: StashItem[] }) {
  return (
    <div className="flex flex-col gap-8">
      {groupByBrand(items).map(({ brand, items: inks }) => (
        <section key={brand.id} aria-labelledby={`stash-brand-${brand.id}`} className="flex flex-col gap-3">
          <h3 id={`stash-brand-${brand.id}`} className="flex flex-wrap items-baseline gap-x-3 border-b border-rule pb-1.5 text-xl font-bold">
            {brand.name}
            <span className="text-base font-normal text-ink-muted">{plural(inks.length, "ink")}</span>
          </h3>
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
            {inks.map((item) => (
              <li key={item.ink.id} className="min-w-0">
                <StashInkCard item={item} />
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
