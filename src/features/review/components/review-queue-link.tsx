import { NavLink, type NavLinkProps } from "react-router";
import { useReviewQueueCount } from "../api/get-review-queue";

type ReviewQueueLinkProps = { className?: NavLinkProps["className"]; onClick?: () => void };

/**
 * "Review queue" with the number of strips waiting, for the header or the account menu.
 * Render it for moderators and admins only.
 */
export function ReviewQueueLink({ className, onClick }: ReviewQueueLinkProps) {
  const count = useReviewQueueCount(true);
  return (
    <NavLink to="/review" className={className} onClick={onClick}>
      Review queue
      {count !== undefined && count > 0 && (
        <span className="ml-1.5 inline-grid min-w-6 place-items-center rounded-full border border-warn/40 bg-warn-soft px-1.5 text-sm font-bold text-warn tabular-nums">
          {count > 99 ? "99+" : count}
          <span className="sr-only"> waiting</span>
        </span>
      )}
    </NavLink>
  );
}
