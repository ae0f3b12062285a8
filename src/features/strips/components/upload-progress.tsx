import { useEffect, useState } from "react";
import { Button } from "../../../components/ui/button";
import type { UploadProgress } from "../api/upload-photo";
import { formatBytes } from "../strip-words";

/** Bytes sent so far, as a real progress bar, with a way to stop. */
export function SendingProgress({ progress, fileName, onCancel }: { progress: UploadProgress | null; fileName: string; onCancel: () => void }) {
  const total = progress?.total ?? 0;
  const loaded = progress?.loaded ?? 0;
  const percent = total > 0 ? Math.min(100, Math.round((loaded / total) * 100)) : 0;
  const done = total > 0 && loaded >= total;
  return (
    <div className="flex flex-col gap-3 rounded-xl border border-rule bg-card p-5 shadow-card" data-testid="upload-progress">
      <p className="font-bold" id="sending-label">
        {done ? "Sent. Waiting for the server to take it…" : `Sending “${fileName}”…`}
      </p>
      <progress
        aria-labelledby="sending-label"
        max={100}
        value={percent}
        className="h-3 w-full overflow-hidden rounded-full [&::-webkit-progress-bar]:bg-paper-shade [&::-webkit-progress-value]:bg-accent [&::-moz-progress-bar]:bg-accent"
      />
      <p className="text-ink-soft tabular-nums" aria-live="polite">
        {total > 0 ? `${formatBytes(loaded)} of ${formatBytes(total)} sent (${percent}%)` : "Starting…"}
      </p>
      <div>
        <Button variant="secondary" onClick={onCancel}>
          Cancel upload
        </Button>
      </div>
    </div>
  );
}

/** The photo is with the server: an honest "still working" with the time so far. */
export function AnalysingProgress({ again = false }: { again?: boolean }) {
  const [started] = useState(() => Date.now());
  const [now, setNow] = useState(started);
  useEffect(() => {
    const timer = window.setInterval(() => setNow(Date.now()), 1000);
    return () => window.clearInterval(timer);
  }, []);
  const seconds = Math.floor((now - started) / 1000);
  return (
    <div role="status" className="flex flex-col gap-3 rounded-xl border border-rule bg-card p-5 shadow-card" data-testid="analysing">
      <p className="font-bold">{again ? "Analysing your photo again…" : "Analysing your photo…"}</p>
      <div aria-hidden="true" className="h-3 w-full overflow-hidden rounded-full bg-paper-shade">
        <div className="blend-ornament progress-slide h-full w-2/5 rounded-full" />
      </div>
      <p className="text-ink-soft">
        Straightening the photo, correcting its colour against the paper white, finding the bands and matching them to
        catalogue inks. This usually takes a few seconds
        <span className="tabular-nums">{seconds >= 3 ? ` (${seconds} s so far)` : ""}</span>.
      </p>
    </div>
  );
}
