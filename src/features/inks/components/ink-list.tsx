import { Link } from "react-router";
import type { Ink } from "../../../../shared/schemas/inks";
import { formatHex, formatNumber } from "../../../lib/format";
import { colourWords } from "../colour-words";
import { InkSwatch } from "./ink-swatch";
import { DiscontinuedBadge, InkTypeBadge } from "./ink-type-badge";

function InkListItem({ ink }: { ink: Ink }) {
  const words = colourWords(ink.lab);
  return (
    <li className="group relative flex flex-wrap items-center gap-x-4 gap-y-3 rounded-lg border border-rule bg-card p-3 shadow-card transition-shadow hover:shadow-lifted has-[a:focus-visible]:outline-3 has-[a:focus-visible]:outline-offset-2 has-[a:focus-visible]:outline-accent sm:flex-nowrap sm:p-4">
      <InkSwatch hex={ink.hex} className="h-14 w-20 sm:h-16 sm:w-28" />
      <div className="min-w-0 flex-1 basis-40">
        <h3 className="text-lg leading-snug font-bold">
          {/* The whole row is clickable; the link's name stays just the ink's name. */}
          <Link
            to={`/inks/${ink.id}`}
            className="rounded-sm after:absolute after:inset-0 after:rounded-lg group-hover:underline focus-visible:outline-none"
          >
            {ink.name}
          </Link>
        </h3>
        <p className="text-ink-soft">{ink.brand.name}</p>
        <p className="text-sm text-ink-muted">{words}</p>
      </div>
      <div className="flex w-full flex-wrap items-center gap-x-4 gap-y-2 border-t border-rule pt-2 sm:w-auto sm:flex-col sm:items-end sm:border-0 sm:pt-0">
        <div className="flex gap-1.5">
          <InkTypeBadge type={ink.type} />
          {ink.discontinued && <DiscontinuedBadge />}
        </div>
        <dl className="flex flex-wrap gap-x-3 text-sm text-ink-soft tabular-nums sm:justify-end">
          <div className="flex gap-1">
            <dt className="sr-only">Hex</dt>
            <dd className="font-bold text-ink">{formatHex(ink.hex)}</dd>
          </div>
          <div className="flex gap-1">
            <dt>L*</dt>
            <dd>{formatNumber(ink.lab.l)}</dd>
          </div>
          <div className="flex gap-1">
            <dt>a*</dt>
            <dd>{formatNumber(ink.lab.a)}</dd>
          </div>
          <div className="flex gap-1">
            <dt>b*</dt>
            <dd>{formatNumber(ink.lab.b)}</dd>
          </div>
        </dl>
      </div>
    </li>
  );
}

export function InkList({ inks, label }: { inks: Ink[]; label: string }) {
  return (
    <ul aria-label={label} className="flex flex-col gap-3">
      {inks.map((ink) => (
        <InkListItem key={ink.id} ink={ink} />
      ))}
    </ul>
  );
}
