import type { ReactNode } from "react";
import type { Upload } from "../../../../shared/schemas/uploads";
import { Button } from "../../../components/ui/button";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { Notice } from "../../../components/ui/notice";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import { AnalysedPhoto, type WhitePoint } from "./analysed-photo";
import { AnalysingProgress } from "./upload-progress";

type ReadyUpload = Upload & { analysis: NonNullable<Upload["analysis"]>; images: NonNullable<Upload["images"]> };

type PostPhotoSectionProps = {
  upload: ReadyUpload;
  /** The upload's status now (the photo shown is the last one that came back ready). */
  status: Upload["status"] | undefined;
  errorMessage?: string;
  /** Shown when the server stopped answering while the photo was being checked. */
  lostTouch: ReactNode;
  alt: string;
  white: WhitePoint | null;
  /** The white point the photo on screen was analysed with. */
  readyWhite: WhitePoint | null;
  onSetWhite: (point: WhitePoint | null) => void;
  busy: boolean;
  onStartOver: () => void;
  /** Drawn in place of the photo (the strip outlines editor), if given. */
  photo?: ReactNode;
  /** Above the photo (the choice between outlines and paper white). */
  above?: ReactNode;
  /** Under the photo's paper-white line (the analysis's notices). */
  below?: ReactNode;
};

/** The analysed photo, with the paper white: what was found, and the tap that corrects it. */
export function PostPhotoSection({ upload, status, errorMessage, lostTouch, alt, white, readyWhite, onSetWhite, busy, onStartOver, photo, above, below }: PostPhotoSectionProps) {
  const { analysis } = upload;
  const processing = status === "processing";
  const rerunFailed = status === "failed";
  return (
    <section aria-labelledby="photo-title" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="photo-title" className="text-2xl font-bold">
          Your photo
        </h2>
        <Button variant="quiet" onClick={onStartOver}>
          Choose another photo
        </Button>
      </div>
      {lostTouch}
      {processing && <AnalysingProgress again />}
      {rerunFailed && (
        <Notice tone="error" title="That spot did not work as paper white" live>
          <p data-testid="rerun-failed-message">{errorMessage ?? "The photo could not be analysed with that point."}</p>
          <p className="mt-2">
            Your photo is kept. Tap a clean patch of white paper beside the strip (not on the ink), or go back to the
            automatic paper white.
          </p>
        </Notice>
      )}
      {above}
      {photo ?? <AnalysedPhoto upload={upload} alt={alt} white={white} onSetWhite={onSetWhite} busy={busy} />}
      <div id="white-point-help" className="flex flex-col gap-3 text-ink-soft">
        <p>
          <strong className="text-ink">Colours look off?</strong>{" "}
          {photo
            ? "Choose “Paper white” above the photo, then tap a clean patch of white paper beside a strip: we correct the colours against it and find the strips again."
            : "Tap or click a clean patch of white paper beside the strip: we correct the colours against it and find the bands again."}
        </p>
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <ColourSwatch hex={analysis.paper.hex} className="h-6 w-8" />
          <span>
            {analysis.paper.found
              ? `Paper white as photographed: ${colourWords(analysis.paper.lab)}, ${formatHex(analysis.paper.hex)}${readyWhite ? " (from the spot you tapped)" : ""}.`
              : "We could not find white paper around the strip, so the colours are not corrected. Tap a patch of white paper to set it."}
          </span>
        </div>
        {(white || rerunFailed) && (
          <div>
            <Button variant="secondary" onClick={() => onSetWhite(null)} disabled={busy}>
              Use the automatic paper white
            </Button>
          </div>
        )}
      </div>
      {below}
    </section>
  );
}
