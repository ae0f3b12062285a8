import type { ReactNode } from "react";

export type BadgeTone = "neutral" | "accent" | "warning" | "strong";

const tones: Record<BadgeTone, string> = {
  neutral: "border-rule-strong bg-paper-shade text-ink-soft",
  accent: "border-accent/30 bg-accent-soft text-accent-deep",
  warning: "border-warn/40 bg-warn-soft text-warn",
  strong: "border-ink bg-ink text-card",
};

export function Badge({ tone = "neutral", children, className = "" }: { tone?: BadgeTone; children: ReactNode; className?: string }) {
  return (
    <span
      className={`inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-bold tracking-wide whitespace-nowrap uppercase ${tones[tone]} ${className}`}
    >
      {children}
    </span>
  );
}
