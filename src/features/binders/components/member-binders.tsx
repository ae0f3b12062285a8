import { Notice } from "../../../components/ui/notice";
import { Loading } from "../../../components/ui/loading";
import { errorMessage } from "../../../lib/api-client";
import { useMemberBinders } from "../api/get-member-binders";
import { BinderSummaryCard } from "./binder-summary-card";

type MemberBindersProps = {
  memberId: string;
  /** The section's heading; defaults to "Binders". */
  title?: string;
};

/**
 * A member's public binders, for their profile page (the member themself also sees their private
 * ones, marked). Renders nothing when there are none, so a profile does not fill up with blanks.
 */
export function MemberBinders({ memberId, title = "Binders" }: MemberBindersProps) {
  const binders = useMemberBinders(memberId);
  const headingId = `member-binders-${memberId}`;

  if (binders.isPending) return <Loading label="Loading binders…" />;
  if (binders.isError) {
    return (
      <Notice tone="error" title="Binders could not be loaded">
        <p>{errorMessage(binders.error)}</p>
      </Notice>
    );
  }
  if (binders.data.length === 0) return null;

  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-4">
      <h2 id={headingId} className="border-b border-rule pb-2 text-2xl font-bold">
        {title}
      </h2>
      <ul className="grid gap-4 sm:grid-cols-2">
        {binders.data.map((b) => (
          <li key={b.id} className="min-w-0">
            <BinderSummaryCard binder={b} />
          </li>
        ))}
      </ul>
    </section>
  );
}
