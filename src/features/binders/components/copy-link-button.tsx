import { useEffect, useId, useRef, useState } from "react";
import { Button } from "../../../components/ui/button";
import { controlClasses } from "../../../components/ui/field";

/**
 * Copies a page's address for sharing. Where the browser refuses the clipboard (an http page, an
 * old browser), the address is shown selected so the member can copy it themselves.
 */
export function CopyLinkButton({ path, label = "Copy link" }: { path: string; label?: string }) {
  const id = useId();
  const url = `${window.location.origin}${path}`;
  const [state, setState] = useState<"idle" | "copied" | "manual">("idle");
  const input = useRef<HTMLInputElement>(null);

  useEffect(() => {
    if (state !== "copied") return;
    const timer = window.setTimeout(() => setState("idle"), 4000);
    return () => window.clearTimeout(timer);
  }, [state]);

  useEffect(() => {
    if (state === "manual") input.current?.select();
  }, [state]);

  async function copy() {
    try {
      if (!navigator.clipboard) throw new Error("no clipboard");
      await navigator.clipboard.writeText(url);
      setState("copied");
    } catch {
      setState("manual");
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <Button variant="secondary" onClick={() => void copy()}>
        {state === "copied" && <span aria-hidden="true">✓</span>}
        {state === "copied" ? "Link copied" : label}
      </Button>
      <p role="status" className="sr-only">
        {state === "copied" ? "The link to this binder is copied." : ""}
      </p>
      {state === "manual" && (
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-url`} className="text-sm font-bold">
            Copy this link:
          </label>
          <input id={`${id}-url`} ref={input} readOnly value={url} className={`${controlClasses} text-sm`} onFocus={(e) => e.currentTarget.select()} />
        </div>
      )}
    </div>
  );
}
