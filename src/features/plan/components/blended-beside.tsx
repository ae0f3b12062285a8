import { Link } from "react-router";
import { hexToLab } from "../../../../shared/colour";
import { Button } from "../../../components/ui/button";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, plural } from "../../../lib/format";
import { useBeside } from "../api/get-beside";

/** What the community blends directly next to an ink, from published strips. */
export function BlendedBeside({ inkId, inkName }: { inkId: number; inkName: string }) {
  const beside = useBeside(inkId);
  if (beside.isPending) return <Loading label="Counting the inks blended next to it…" />;
  if (beside.isError)
    return (
      <Notice tone="error" title="These could not be loaded" live>
        <p>{errorMessage(beside.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void beside.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  if (!beside.data.items.length) return <p className="text-ink-soft">No published strip has an ink blended straight into {inkName} yet.</p>;
  return (
    <ol className="grid gap-3 sm:grid-cols-2" aria-label={`Inks blended next to ${inkName}, most often first`}>
      {beside.data.items.map((item) => (
        <li key={item.ink.id} className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-3" data-testid="beside-ink">
          <div className="flex items-center gap-3">
            <ColourSwatch hex={item.ink.hex} className="h-10 w-14" />
            <span className="min-w-0 flex-1 leading-tight">
              <Link to={`/inks/${item.ink.id}`} className="block font-bold hover:underline">
                {item.ink.name}
              </Link>
              <span className="block text-sm text-ink-soft">
                {item.ink.brand} · {colourWords(hexToLab(item.ink.hex))} · <span className="tabular-nums">{formatHex(item.ink.hex)}</span>
              </span>
            </span>
            <span className="text-right text-sm font-bold whitespace-nowrap">{plural(item.strips, "strip")}</span>
          </div>
          <ul className="flex flex-col gap-0.5 text-sm">
            {item.examples.map((s) => (
              <li key={s.id}>
                <Link to={`/strips/${s.id}`} className="text-accent underline hover:text-accent-deep">
                  {s.title}
                </Link>
              </li>
            ))}
          </ul>
          <p className="flex flex-wrap gap-x-4 text-sm">
            <Link to={`/search?ink=${inkId}&ink=${item.ink.id}&adjacent=true`} className="font-bold text-accent underline">
              All strips with the two side by side
            </Link>
            <Link to={`/plan?inks=${inkId},${item.ink.id}`} className="font-bold text-accent underline">
              Plan these two
            </Link>
          </p>
        </li>
      ))}
    </ol>
  );
}
