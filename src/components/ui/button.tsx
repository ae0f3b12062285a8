import type { ButtonHTMLAttributes, ReactNode } from "react";
import { Link, type LinkProps } from "react-router";

export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger";

const base =
  "inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 font-bold leading-tight transition-colors disabled:cursor-not-allowed disabled:opacity-60";

const variants: Record<ButtonVariant, string> = {
  primary: "bg-accent text-card hover:bg-accent-deep shadow-sm",
  secondary: "border border-rule-strong bg-card text-ink hover:border-ink-muted hover:bg-paper-shade",
  quiet: "text-accent underline-offset-4 hover:underline hover:bg-accent-soft",
  danger: "bg-danger text-card hover:bg-danger/90",
};

export function buttonClasses(variant: ButtonVariant = "primary", extra = ""): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  /** Shows a busy state and blocks a second press. */
  busy?: boolean;
  busyLabel?: ReactNode;
};

export function Button({
  variant = "primary",
  busy = false,
  busyLabel,
  className = "",
  type = "button",
  disabled,
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? (
        <>
          <span aria-hidden="true" className="h-4 w-4 animate-spin rounded-full border-2 border-current border-r-transparent" />
          {busyLabel ?? children}
        </>
      ) : (
        children
      )}
    </button>
  );
}

export function ButtonLink({
  variant = "primary",
  className = "",
  ...rest
}: LinkProps & { variant?: ButtonVariant }) {
  return <Link className={buttonClasses(variant, className)} {...rest} />;
}
