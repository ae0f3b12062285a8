import { useId, useState } from "react";
import { Link, NavLink, useLocation } from "react-router";
import { useMe } from "../../features/accounts/api/get-me";
import { AccountMenu } from "../../features/accounts/components/account-menu";
import { NoticesLink } from "../../features/notices/components/notices-link";
import { ReviewQueueLink } from "../../features/review/components/review-queue-link";
import { canModerate } from "../../lib/roles";
import { RoleBadge } from "../../features/accounts/components/role-badge";
import { SignOutButton } from "../../features/accounts/components/sign-out-button";

const navItems = [
  { to: "/gallery", label: "Gallery", end: false },
  { to: "/search", label: "Search", end: false },
  { to: "/plan", label: "Plan", end: false },
  { to: "/inks", label: "Inks", end: false },
  { to: "/help", label: "Help", end: false },
] as const;

const navLinkClasses = ({ isActive }: { isActive: boolean }) =>
  `flex min-h-11 items-center rounded-md px-3 font-bold transition-colors ${
    isActive ? "bg-ink text-card" : "text-ink-soft hover:bg-paper-shade hover:text-ink"
  }`;

export function Wordmark() {
  return (
    <Link to="/" className="group flex min-h-11 flex-col justify-center rounded-md pr-2">
      <span className="text-2xl leading-none font-bold tracking-tight">Blendwell</span>
      <span aria-hidden="true" className="blend-ornament mt-1 h-1.5 w-full rounded-full opacity-90 group-hover:opacity-100" />
    </Link>
  );
}

/** The one call to action for members, kept in the header on every screen size. */
function PostStripLink({ className = "" }: { className?: string }) {
  return (
    <NavLink
      to="/post"
      className={({ isActive }) =>
        `inline-flex min-h-11 items-center gap-1.5 rounded-md px-3 font-bold whitespace-nowrap text-card shadow-sm sm:px-4 ${
          isActive ? "bg-accent-deep" : "bg-accent hover:bg-accent-deep"
        } ${className}`
      }
    >
      <span aria-hidden="true" className="text-lg leading-none">
        +
      </span>
      Post a strip
    </NavLink>
  );
}

function SignInLink({ className = "" }: { className?: string }) {
  const location = useLocation();
  const here = `${location.pathname}${location.search}`;
  const next = location.pathname.startsWith("/sign-in") || here === "/" ? "" : `?next=${encodeURIComponent(here)}`;
  return (
    <Link
      to={`/sign-in${next}`}
      className={`inline-flex min-h-11 items-center rounded-md bg-accent px-4 font-bold text-card hover:bg-accent-deep ${className}`}
    >
      Sign in
    </Link>
  );
}

/** The phone menu: the same links, stacked, with the account's items inline (no nested menu). */
function MobileMenu({ id, onClose }: { id: string; onClose: () => void }) {
  const { data: me } = useMe();
  return (
    <div id={id} className="border-t border-rule bg-card px-4 pt-2 pb-4 sm:hidden">
      <ul className="flex flex-col gap-1">
        {navItems.map((item) => (
          <li key={item.to}>
            <NavLink to={item.to} end={item.end} className={navLinkClasses} onClick={onClose}>
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
      <div className="mt-3 border-t border-rule pt-3">
        {me ? (
          <>
            <p className="flex flex-wrap items-center gap-2 px-3 pb-2">
              <span className="font-bold">{me.name || me.email}</span>
              <RoleBadge role={me.role} />
            </p>
            <ul className="flex flex-col gap-1">
              <li>
                <NoticesLink className={navLinkClasses} onClick={onClose} />
              </li>
              {canModerate(me.role) && (
                <li>
                  <ReviewQueueLink className={navLinkClasses} onClick={onClose} />
                </li>
              )}
              <li>
                <NavLink to={`/members/${me.id}`} className={navLinkClasses} onClick={onClose}>
                  Your strips
                </NavLink>
              </li>
              <li>
                <NavLink to="/binders" className={navLinkClasses} onClick={onClose}>
                  Binders
                </NavLink>
              </li>
              <li>
                <NavLink to="/stash" className={navLinkClasses} onClick={onClose}>
                  Stash
                </NavLink>
              </li>
              <li>
                <NavLink to="/account" className={navLinkClasses} onClick={onClose}>
                  Account
                </NavLink>
              </li>
              <li>
                <SignOutButton
                  onDone={onClose}
                  className="flex min-h-11 w-full items-center rounded-md px-3 text-left font-bold text-ink-soft hover:bg-paper-shade hover:text-ink disabled:opacity-60"
                />
              </li>
            </ul>
          </>
        ) : (
          <SignInLink className="w-full justify-center" />
        )}
      </div>
    </div>
  );
}

export function SiteHeader() {
  const menuId = useId();
  const [menuOpen, setMenuOpen] = useState(false);
  const location = useLocation();
  const { data: me, isPending } = useMe();

  // Close the phone menu as soon as the page changes (set during render, not in an effect, so a
  // tap that follows the change at once is not undone).
  const [menuPath, setMenuPath] = useState(location.pathname);
  if (menuPath !== location.pathname) {
    setMenuPath(location.pathname);
    setMenuOpen(false);
  }

  return (
    <header className="sticky top-0 z-30 border-b border-rule bg-paper/95 backdrop-blur supports-[backdrop-filter]:bg-paper/85">
      <div className="mx-auto flex max-w-5xl items-center gap-2 px-4 py-2 sm:gap-6">
        <Wordmark />
        <nav aria-label="Main" className="hidden sm:block">
          <ul className="flex gap-1">
            {navItems.map((item) => (
              <li key={item.to}>
                <NavLink to={item.to} end={item.end} className={navLinkClasses}>
                  {item.label}
                </NavLink>
              </li>
            ))}
            {me && canModerate(me.role) && (
              <li>
                <ReviewQueueLink className={navLinkClasses} />
              </li>
            )}
            {me && (
              <li>
                <NoticesLink className={navLinkClasses} />
              </li>
            )}
          </ul>
        </nav>
        <div className="ml-auto flex items-center gap-2">
          {me && <PostStripLink />}
          <div className="hidden sm:block">
            {isPending ? (
              <span className="inline-block h-11 w-24" aria-hidden="true" />
            ) : me ? (
              <AccountMenu me={me} />
            ) : (
              <SignInLink />
            )}
          </div>
        </div>
        <button
          type="button"
          className="inline-flex min-h-11 min-w-11 shrink-0 items-center gap-2 rounded-md border border-rule-strong bg-card px-3 font-bold sm:hidden"
          aria-expanded={menuOpen}
          aria-controls={menuId}
          onClick={() => setMenuOpen((o) => !o)}
        >
          <span aria-hidden="true" className="flex w-4 shrink-0 flex-col gap-[3px]">
            <span className={`h-0.5 rounded bg-current transition-transform ${menuOpen ? "translate-y-[5px] rotate-45" : ""}`} />
            <span className={`h-0.5 rounded bg-current ${menuOpen ? "opacity-0" : ""}`} />
            <span className={`h-0.5 rounded bg-current transition-transform ${menuOpen ? "-translate-y-[5px] -rotate-45" : ""}`} />
          </span>
          Menu
        </button>
      </div>
      {menuOpen && (
        <nav aria-label="Main (phone)">
          <MobileMenu id={menuId} onClose={() => setMenuOpen(false)} />
        </nav>
      )}
    </header>
  );
}
