import { useMemo } from "react";
import type { Lab } from "../../../../shared/colour";
import { previewGradient, previewLayout } from "../../../../shared/colour/blend-preview";

type BlendStripProps = {
  labs: Lab[];
  /** Read out instead of the colours, e.g. "Blend preview: Lemon Curd, then Harbour Blue". */
  label: string;
  className?: string;
};

/**
 * The rendered strip: flat bands and the joins the blend model predicts (shared/colour, the
 * model the analysis fits to real strips). Decorative to screen readers beyond its label: the
 * words and numbers sit beside it.
 */
export function BlendStrip({ labs, label, className = "h-20 sm:h-24" }: BlendStripProps) {
  const gradient = useMemo(() => previewGradient(previewLayout(labs)), [labs]);
  return (
    <div
      role="img"
      aria-label={label}
      className={`swatch-ink w-full rounded-md border border-rule print:border-ink ${className}`}
      style={{ backgroundImage: gradient, printColorAdjust: "exact", WebkitPrintColorAdjust: "exact" }}
    />
  );
}
