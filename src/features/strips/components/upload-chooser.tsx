import { useId, useRef, useState, type DragEvent, type ReactNode } from "react";
import { formatBytes } from "../strip-words";

/** The server's limit (20 MB); checked here first so nobody waits for a doomed upload. */
export const MAX_PHOTO_BYTES = 20 * 1024 * 1024;

/** A problem with the chosen file that we can see before sending it, or null. */
export function photoProblem(file: File): string | null {
  if (file.size === 0) return "That file is empty. Please choose a photo of your strip.";
  if (file.type && !file.type.startsWith("image/")) {
    return `“${file.name}” is not a photo. Please choose a JPEG, PNG, WebP or HEIC photo.`;
  }
  if (file.size > MAX_PHOTO_BYTES) {
    return `This photo is ${formatBytes(file.size)}; the most we take is ${formatBytes(MAX_PHOTO_BYTES)}. Please choose a smaller photo, or take it at a lower resolution.`;
  }
  return null;
}

type UploadChooserProps = {
  onFile: (file: File) => void;
  disabled?: boolean;
  /** The last problem (from the check above or the server), shown inside the chooser. */
  problem?: ReactNode;
};

const pickButton =
  "inline-flex min-h-11 cursor-pointer items-center justify-center gap-2 rounded-md px-4 py-2 font-bold has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-accent";

/**
 * Take a photo (phones open the back camera), choose one from the device, or drop one here on a
 * desktop. The chosen file goes straight to `onFile`.
 */
export function UploadChooser({ onFile, disabled = false, problem }: UploadChooserProps) {
  const id = useId();
  const [dragging, setDragging] = useState(false);
  const [dropNote, setDropNote] = useState<string | null>(null);
  const depth = useRef(0);

  function take(files: FileList | null) {
    const file = files?.[0];
    if (!file) return;
    setDropNote(files && files.length > 1 ? `You dropped ${files.length} files; we took the first, “${file.name}”.` : null);
    onFile(file);
  }

  function onDrop(e: DragEvent) {
    e.preventDefault();
    depth.current = 0;
    setDragging(false);
    if (!disabled) take(e.dataTransfer.files);
  }

  return (
    <div
      onDragEnter={(e) => {
        e.preventDefault();
        depth.current += 1;
        setDragging(true);
      }}
      onDragLeave={() => {
        depth.current = Math.max(0, depth.current - 1);
        if (depth.current === 0) setDragging(false);
      }}
      onDragOver={(e) => {
        e.preventDefault();
        e.dataTransfer.dropEffect = disabled ? "none" : "copy";
      }}
      onDrop={onDrop}
      data-testid="photo-drop-zone"
      className={`flex flex-col items-center gap-4 rounded-xl border-2 border-dashed px-4 py-8 text-center transition-colors sm:px-8 sm:py-12 ${
        dragging ? "border-accent bg-accent-soft" : "border-rule-strong bg-card"
      }`}
    >
      <div aria-hidden="true" className="blend-ornament h-3 w-32 rounded-full" />
      <p className="text-xl font-bold">Your dried strip, on its white card</p>
      <div className="flex w-full flex-col gap-3 sm:w-auto sm:flex-row">
        <label className={`${pickButton} bg-accent text-card shadow-sm hover:bg-accent-deep ${disabled ? "pointer-events-none opacity-60" : ""}`}>
          <input
            id={`${id}-camera`}
            type="file"
            accept="image/*"
            capture="environment"
            className="sr-only"
            disabled={disabled}
            onChange={(e) => {
              take(e.target.files);
              e.target.value = "";
            }}
          />
          Take a photo
        </label>
        <label
          className={`${pickButton} border border-rule-strong bg-card text-ink hover:bg-paper-shade ${disabled ? "pointer-events-none opacity-60" : ""}`}
        >
          <input
            id={`${id}-file`}
            type="file"
            accept="image/*,.heic,.heif"
            className="sr-only"
            disabled={disabled}
            onChange={(e) => {
              take(e.target.files);
              e.target.value = "";
            }}
          />
          Choose a photo
        </label>
      </div>
      <p className="text-ink-soft">
        <span className="hidden pointer-fine:inline">Or drop a photo here. </span>
        JPEG, PNG, WebP or HEIC, up to {formatBytes(MAX_PHOTO_BYTES)}.
      </p>
      {dropNote && <p className="text-sm text-ink-muted">{dropNote}</p>}
      {problem && <div className="w-full text-left">{problem}</div>}
    </div>
  );
}
