import { useRef, useState } from "react";
import type { Outline, StripReading, Upload, UploadImages } from "../../../../shared/schemas/uploads";
import { MAX_STRIPS } from "../../../../shared/schemas/outlines";
import { Button } from "../../../components/ui/button";
import { errorMessage } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useCorrectOutline } from "../api/correct-outline";
import { changeWords, newStripOutline, outlineTrouble } from "../outline-editing";
import { StripOutlinesEditor } from "./strip-outlines-editor";

export type OutlineAction = { kind: "read" | "add" | "remove"; index: number };

type StripOutlinesPanelProps = {
  uploadId: string;
  images: UploadImages;
  alt: string;
  strips: StripReading[];
  /** Strips already posted: their outlines are fixed. */
  locked?: number[];
  /** The photo is being analysed again (white point): outlines wait. */
  busy: boolean;
  /** After the server has read the strips again: what was done, and the upload as it now is. */
  onChanged: (action: OutlineAction, upload: Upload) => void;
};

type Request = { stripIndex: number; outline: Outline | null; action: OutlineAction };

/**
 * The strips found on the photo, outlined and numbered, with the member's own corrections: drag
 * the selected strip's corners (we read it again on release), add a strip, remove one. Every
 * result is said in words in a live region ("Strip 2 now has 4 bands").
 */
export function StripOutlinesPanel({ uploadId, images, alt, strips, locked = [], busy, onChanged }: StripOutlinesPanelProps) {
  const correct = useCorrectOutline(uploadId);
  const [picked, setPicked] = useState(0);
  const [edits, setEdits] = useState<Record<number, Outline>>({});
  const [said, setSaid] = useState("");
  const [trouble, setTrouble] = useState<{ index: number; text: string } | null>(null);
  const queued = useRef<Request | null>(null);
  const selected = Math.min(picked, strips.length - 1);
  const outlines = strips.map((s, i) => edits[i] ?? s.outline);
  const working = correct.isPending;

  function send(req: Request) {
    // One request at a time; a newer correction waits for the one in flight and replaces any queued.
    if (correct.isPending) {
      queued.current = req;
      return;
    }
    const before = strips;
    correct.mutate(
      { stripIndex: req.stripIndex, outline: req.outline },
      {
        onSuccess: (upload) => {
          const after = upload.analysis?.strips ?? [];
          setSaid(changeWords(before, after, req.action));
          setTrouble(null);
          setEdits((old) => {
            if (req.action.kind !== "read") return {};
            // Keep a corner the member has moved again since this was sent (its own reading is queued).
            if (old[req.stripIndex] !== req.outline) return old;
            const rest = { ...old };
            delete rest[req.stripIndex];
            return rest;
          });
          if (req.action.kind === "add") setPicked(req.action.index);
          if (req.action.kind === "remove") setPicked(Math.max(0, Math.min(req.action.index, after.length - 1)));
          onChanged(req.action, upload);
        },
        onError: (error) => {
          setSaid(`Strip ${req.stripIndex + 1} was not changed: ${errorMessage(error)}`);
          setTrouble({ index: req.stripIndex, text: errorMessage(error) });
        },
        onSettled: () => {
          const next = queued.current;
          queued.current = null;
          if (next) window.setTimeout(() => send(next), 0);
        },
      },
    );
  }

  function release(index: number, outline: Outline) {
    setEdits((old) => ({ ...old, [index]: outline }));
    const problem = outlineTrouble(outline, index + 1);
    if (problem) {
      setTrouble({ index, text: problem });
      setSaid(problem);
      return;
    }
    setTrouble(null);
    send({ stripIndex: index, outline, action: { kind: "read", index } });
  }

  function readAgain() {
    release(selected, outlines[selected]!);
  }

  function add() {
    const index = strips.length;
    send({ stripIndex: index, outline: newStripOutline(outlines), action: { kind: "add", index } });
  }

  function remove() {
    send({ stripIndex: selected, outline: null, action: { kind: "remove", index: selected } });
  }

  const n = selected + 1;
  const fixed = locked.includes(selected);
  return (
    <div className="flex flex-col gap-4" data-testid="strip-outlines-panel">
      <StripOutlinesEditor
        images={images}
        alt={alt}
        outlines={outlines}
        selected={selected}
        onSelect={setPicked}
        onMove={(i, o) => setEdits((old) => ({ ...old, [i]: o }))}
        onRelease={release}
        troubled={trouble ? [trouble.index] : []}
        locked={locked}
        busy={busy}
      />
      <p id="outline-help" className="text-ink-soft">
        {strips.length === 1 ? "We outlined the strip we found." : `We found ${plural(strips.length, "strip")}, numbered top to bottom, then left to right.`}{" "}
        Drag the four round handles of the chosen strip onto its corners; we read it again when you let go. With a keyboard,
        Tab to a handle and move it with the arrow keys (hold Shift for bigger steps).
      </p>
      <div role="group" aria-label="Choose a strip to adjust" className="flex flex-wrap gap-2">
        {strips.map((s, i) => (
          <button
            key={i}
            type="button"
            aria-pressed={i === selected}
            onClick={() => setPicked(i)}
            className="inline-flex min-h-11 items-center gap-2 rounded-md border border-rule-strong bg-card px-3 font-bold text-ink aria-pressed:border-accent aria-pressed:bg-accent aria-pressed:text-card"
            data-testid="strip-choice"
          >
            Strip {i + 1}
            <span className="font-normal">
              · {plural(s.bands.length, "band")}
              {locked.includes(i) ? " · posted" : ""}
            </span>
          </button>
        ))}
      </div>
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" onClick={readAgain} busy={working} busyLabel="Reading…" disabled={busy || fixed}>
          Read strip {n} again
        </Button>
        <Button variant="secondary" onClick={add} disabled={busy || working || strips.length >= MAX_STRIPS}>
          Add a strip
        </Button>
        <Button variant="quiet" onClick={remove} disabled={busy || working || fixed || strips.length <= 1}>
          Remove strip {n}
        </Button>
      </div>
      {fixed && <p className="text-sm text-ink-soft">Strip {n} is posted, so its outline stays as it was posted.</p>}
      {strips.length <= 1 && <p className="text-sm text-ink-soft">A photo keeps at least one strip; to start again, choose another photo.</p>}
      {trouble && (
        <p className="rounded-md border border-danger/40 bg-danger-soft p-3 text-ink" data-testid="outline-trouble">
          {trouble.text}
        </p>
      )}
      <p role="status" aria-live="polite" className="min-h-6 font-bold text-ink" data-testid="outline-status">
        {said}
      </p>
    </div>
  );
}
