import { buttonClasses } from "../../../components/ui/button";

type PrintLinksProps = {
  /** "/api/plan/card.pdf?inks=1,2" — the paper size is added per link. */
  href: string;
  what: string;
};

/** Download links for a printable sheet on A4 and on US Letter paper. */
export function PrintLinks({ href, what }: PrintLinksProps) {
  const join = href.includes("?") ? "&" : "?";
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-soft">Print {what} (PDF, readable in black and white):</p>
      <div className="flex flex-wrap gap-2">
        <a className={buttonClasses("secondary")} href={`${href}${join}paper=a4`} download>
          {what[0]!.toUpperCase() + what.slice(1)}, A4
        </a>
        <a className={buttonClasses("secondary")} href={`${href}${join}paper=letter`} download>
          {what[0]!.toUpperCase() + what.slice(1)}, US Letter
        </a>
      </div>
    </div>
  );
}
