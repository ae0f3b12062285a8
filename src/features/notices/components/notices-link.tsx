import { NavLink, type NavLinkProps } from "react-router";
import { useUnreadNoticeCount } from "../api/get-notices";

type NoticesLinkProps = { className?: NavLinkProps["className"]; onClick?: () => void };

/** "Notices" with the number unread, for the header or the account menu. Render it for signed-in people. */
export function NoticesLink({ className, onClick }: NoticesLinkProps) {
  const unread = useUnreadNoticeCount(true);
  return (
    <NavLink to="/notices" className={className} onClick={onClick}>
      Notices
      {unread !== undefined && unread > 0 && (
        <span className="ml-1.5 inline-grid min-w-6 place-items-center rounded-full bg-accent px-1.5 text-sm font-bold text-card tabular-nums">
          {unread > 99 ? "99+" : unread}
          <span className="sr-only"> unread</span>
        </span>
      )}
    </NavLink>
  );
}
