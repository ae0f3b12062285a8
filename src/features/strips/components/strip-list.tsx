import type { ReactNode } from "react";
import type { Strip } from "../../../../shared/schemas/strips";
import { StripRow } from "./strip-row";

type StripListProps = {
  strips: Strip[];
  label: string;
  showStatus?: boolean;
  hideAuthor?: boolean;
  /** How many rows at the top load their photo at once. */
  eagerCount?: number;
  /** Per-strip controls from other features, passed down from the route. */
  actions?: (strip: Strip) => ReactNode;
};

/** Strips one under another, each a full-width band. */
export function StripList({ strips, label, showStatus, hideAuthor, eagerCount = 0, actions }: StripListProps) {
  return (
    <ul aria-label={label} className="flex flex-col gap-5">
      {strips.map((strip, i) => (
        <li key={strip.id}>
          <StripRow strip={strip} showStatus={showStatus} hideAuthor={hideAuthor} eager={i < eagerCount} actions={actions?.(strip)} />
        </li>
      ))}
    </ul>
  );
}
