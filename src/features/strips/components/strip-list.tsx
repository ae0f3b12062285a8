import type { ReactNode } from "react";
import type { Strip } from "../../../../shared/schemas/strips";
import { StripRow } from "./strip-row";

type StripListProps<S extends Strip> = {
  strips: S[];
  label: string;
  showStatus?: boolean;
  hideAuthor?: boolean;
  /** How many rows at the top load their photo at once. */
  eagerCount?: number;
  /** Per-strip controls from other features, passed down from the route. */
  actions?: (strip: S) => ReactNode;
  /** Per-strip lines above the ink chips (e.g. why a search found it). */
  details?: (strip: S) => ReactNode;
};

/** Strips one under another, each a full-width band. */
export function StripList<S extends Strip>({ strips, label, showStatus, hideAuthor, eagerCount = 0, actions, details }: StripListProps<S>) {
  return (
    <ul aria-label={label} className="flex flex-col gap-5">
      {strips.map((strip, i) => (
        <li key={strip.id}>
          <StripRow strip={strip} showStatus={showStatus} hideAuthor={hideAuthor} eager={i < eagerCount} actions={actions?.(strip)} details={details?.(strip)} />
        </li>
      ))}
    </ul>
  );
}
