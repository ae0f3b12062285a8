import { useEffect, useId, useRef, useState } from "react";
import { Link } from "react-router";
import type { Me } from "../../../../shared/schemas/accounts";
import { RoleBadge } from "./role-badge";
import { SignOutButton } from "./sign-out-button";

/** The signed-in member's name, opening a small menu: Your strips, Binders, Stash, Account, Sign out. */
export function AccountMenu({ me }: { me: Me }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const wrapper = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!wrapper.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener("pointerdown", onPointer);
    document.addEventListener("keydown", onKey);
    return () => {
      document.removeEventListener("pointerdown", onPointer);
      document.removeEventListener("keydown", onKey);
    };
  }, [open]);

  const itemClasses =
    "flex min-h-11 w-full items-center rounded-md px-3 text-left font-bold text-ink hover:bg-paper-shade disabled:opacity-60";

  return (
    <div
      ref={wrapper}
      className="relative"
      onBlur={(e) => {
        if (open && !wrapper.current?.contains(e.relatedTarget as Node | null)) setOpen(false);
      }}
    >
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={`${id}-menu`}
        onClick={() => setOpen((o) => !o)}
        className="flex min-h-11 max-w-[16rem] items-center gap-2 rounded-md border border-rule-strong bg-card px-3 font-bold hover:bg-paper-shade"
      >
        <span className="sr-only">Account menu for </span>
        <span className="truncate">{me.name || me.email}</span>
        <RoleBadge role={me.role} />
        <span aria-hidden="true" className={`text-xs transition-transform ${open ? "rotate-180" : ""}`}>
          ▾
        </span>
      </button>
      <div
        id={`${id}-menu`}
        hidden={!open}
        className="absolute right-0 z-40 mt-2 w-60 rounded-lg border border-rule bg-card p-1.5 shadow-lifted"
      >
        <p className="truncate px-3 pt-1.5 pb-2 text-sm text-ink-muted">{me.email}</p>
        <ul className="flex flex-col">
          <li>
            <Link to={`/members/${me.id}`} className={itemClasses} onClick={() => setOpen(false)}>
              Your strips
            </Link>
          </li>
          <li>
            <Link to="/binders" className={itemClasses} onClick={() => setOpen(false)}>
              Binders
            </Link>
          </li>
          <li>
            <Link to="/stash" className={itemClasses} onClick={() => setOpen(false)}>
              Stash
            </Link>
          </li>
          <li>
            <Link to="/account" className={itemClasses} onClick={() => setOpen(false)}>
              Account
            </Link>
          </li>
          <li>
            <SignOutButton className={itemClasses} onDone={() => setOpen(false)} />
          </li>
        </ul>
      </div>
    </div>
  );
}
