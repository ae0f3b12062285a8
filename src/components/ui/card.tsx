import type { HTMLAttributes } from "react";

/** A sheet of cardstock: the surface most content sits on. */
export function Card({ className = "", ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={`rounded-xl border border-rule bg-card p-5 shadow-card sm:p-6 ${className}`} {...rest} />;
}
