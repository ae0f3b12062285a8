import { buttonClasses } from "../../../components/ui/button";

/** Downloads the stash as CSV (brand,name,running_low), the layout the import reads. */
export function StashExportLink({ className = "" }: { className?: string }) {
  return (
    <a href="/api/stash/export" download="blendwell-stash.csv" className={buttonClasses("secondary", className)}>
      <span aria-hidden="true">↓</span> Download as CSV
    </a>
  );
}
