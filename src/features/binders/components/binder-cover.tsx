import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { hexInWords } from "../colour-text";

type BinderCoverProps = {
  cover: string[];
  /** Also list the colours in words under the swatches (lists of binders); off for tiny covers. */
  showWords?: boolean;
  className?: string;
};

/** The inks of a binder's first strips side by side, like a blended strip, with their names in words. */
export function BinderCover({ cover, showWords = true, className = "" }: BinderCoverProps) {
  if (cover.length === 0) {
    return (
      <div className={className}>
        <div aria-hidden="true" className="h-10 rounded-md border border-dashed border-rule-strong bg-paper" />
        {showWords && <p className="mt-1 text-sm text-ink-muted">No strips to show yet.</p>}
      </div>
    );
  }
  return (
    <div className={className}>
      <div aria-hidden="true" className="flex h-10 overflow-hidden rounded-md">
        {cover.map((hex) => (
          <ColourSwatch key={hex} hex={hex} className="h-full min-w-0 flex-1 rounded-none" />
        ))}
      </div>
      {showWords ? (
        <p className="mt-1 text-sm text-ink-muted">
          <span className="sr-only">Colours in this binder: </span>
          {cover.map(hexInWords).join(" · ")}
        </p>
      ) : (
        <p className="sr-only">Colours in this binder: {cover.map(hexInWords).join(", ")}</p>
      )}
    </div>
  );
}
