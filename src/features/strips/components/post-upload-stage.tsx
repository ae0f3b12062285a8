import { useState } from "react";
import { Link, useNavigate } from "react-router";
import type { Me } from "../../../../shared/schemas/accounts";
import { stripReadings } from "../../../../shared/schemas/outlines";
import type { AnalysisBand, InkSuggestion, StripReading, Upload } from "../../../../shared/schemas/uploads";
import { SegmentedChoice } from "../../../components/ui/segmented-choice";
import { Button } from "../../../components/ui/button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage, isApiError } from "../../../lib/api-client";
import type { CreatedStrip } from "../api/create-strip";
import { useUpload } from "../api/get-upload";
import { useReanalyseUpload } from "../api/reanalyse-upload";
import { prefillInks, withSuggestion, type InkChoice, type InkColourLookup, type InkPickerSlot } from "../ink-choice";
import { draftsFollowing, titleFor, withPosted, type StripDraft } from "../strip-drafts";
import { stripAlt } from "../strip-words";
import type { WhitePoint } from "./analysed-photo";
import { AnalysisNotices } from "./analysis-notices";
import { BatchPostForm, type BatchResult } from "./batch-post-form";
import { BatchPostedSummary } from "./batch-posted-summary";
import { StripOutlinesPanel } from "./strip-outlines-panel";
import { PostBandsSection } from "./post-bands-section";
import { PostPhotoSection } from "./post-photo-section";
import { PostedPending } from "./post-posted-pending";
import { PostStripForm } from "./post-strip-form";
import { AnalysingProgress } from "./upload-progress";

/** The catalogue's parts the posting page needs; the route supplies them (features do not import each other). */
export type PostInkTools = {
  picker: InkPickerSlot;
  /** Reference colours of these inks, as they load (a hook: call it on every render). */
  useInkColours: (ids: number[]) => InkColourLookup;
};

type ReadyUpload = Upload & { analysis: NonNullable<Upload["analysis"]>; images: NonNullable<Upload["images"]> };

function isReady(upload: Upload | undefined): upload is ReadyUpload {
  return upload?.status === "ready" && upload.analysis !== undefined && upload.images !== undefined;
}

/** The photo's strips; an analysis from before several-strip photos is one strip without an outline. */
const readingsOf = (upload: ReadyUpload | null) => (upload ? stripReadings(upload.analysis) : []);

type PhotoMode = "outlines" | "white";

/** Step two: the analysed photo, the member's ink order and details, and posting. */
export function UploadStage({ uploadId, me, onStartOver, inkTools }: { uploadId: string; me: Me; onStartOver: () => void; inkTools: PostInkTools }) {
  const navigate = useNavigate();
  const upload = useUpload(uploadId);
  const reanalyse = useReanalyseUpload(uploadId);
  const [lastReady, setLastReady] = useState<ReadyUpload | null>(null);
  const [inks, setInks] = useState<InkChoice[]>([]);
  const [inksTouched, setInksTouched] = useState(false);
  const [remeasured, setRemeasured] = useState(false);
  const [white, setWhite] = useState<WhitePoint | null>(null);
  // The white point the photo on screen was analysed with (a failed re-run leaves it as it was).
  const [readyWhite, setReadyWhite] = useState<WhitePoint | null>(null);
  const [posted, setPosted] = useState<CreatedStrip | null>(null);
  // Several strips: one draft each, and what the last "Post N strips" did.
  const [drafts, setDrafts] = useState<StripDraft[]>([]);
  const [batchResults, setBatchResults] = useState<BatchResult[] | null>(null);
  const [mode, setMode] = useState<PhotoMode | null>(null);

  // Each fresh "ready" answer replaces the photo and bands; the ink order follows it until the
  // member has changed it.
  const data = upload.data;
  if (isReady(data) && data !== lastReady) {
    if (lastReady && inksTouched) setRemeasured(true);
    else setInks(prefillInks(data.analysis.bands));
    const before = readingsOf(lastReady);
    // A one-strip photo that gains strips keeps the ink order the member already set for strip 1.
    const base = before.length === 1 && drafts[0] && inksTouched ? [{ ...drafts[0], inks, inksTouched, title: titleFor(inks) }] : drafts;
    setDrafts(withPosted(draftsFollowing(before, base, readingsOf(data)), data.posted));
    setLastReady(data);
    setReadyWhite(white);
  }

  const readings = readingsOf(lastReady);
  const suggestionIds = readings.flatMap((r) => r.bands.flatMap((b) => b.suggestions.map((s) => s.inkId)));
  const inkColour = inkTools.useInkColours([...suggestionIds, ...inks.map((i) => i.id), ...drafts.flatMap((d) => d.inks.map((i) => i.id))]);
  const { picker } = inkTools;

  function changeInks(next: InkChoice[]) {
    setInksTouched(true);
    setInks(next);
  }

  function applySuggestion(band: AnalysisBand, s: InkSuggestion) {
    if (inks.some((i) => i.id === s.inkId)) {
      toast.info(`${s.name} is already in the ink order.`);
      return;
    }
    changeInks(withSuggestion(inks, band.index, s));
    toast.info(`${s.name} is now the ink for band ${band.index + 1}.`);
  }

  function setWhitePoint(point: WhitePoint | null) {
    if (data?.status === "processing" || reanalyse.isPending) return;
    reanalyse.mutate(point ? { white: point } : {}, {
      onSuccess: () => {
        setWhite(point);
        setRemeasured(false);
      },
    });
  }

  function onPosted(result: CreatedStrip) {
    if (result.status === "published") {
      toast.success("Your strip is published in the gallery.", "Posted");
      void navigate(`/strips/${result.id}`);
    } else {
      setPosted(result);
      window.scrollTo({ top: 0 });
    }
  }

  if (posted) return <PostedPending result={posted} onAnother={onStartOver} />;

  if (upload.isPending) return <Loading label="Checking your photo…" />;

  if (upload.isError && !data) {
    const gone = isApiError(upload.error) && upload.error.status === 404;
    return (
      <Notice tone="error" title={gone ? "This photo upload was not found" : "Your photo could not be checked"} live>
        <p>
          {gone
            ? "It may have been removed (unposted photos are kept for 7 days) or belong to another account."
            : errorMessage(upload.error)}
        </p>
        <div className="mt-3 flex flex-wrap gap-3">
          {!gone && (
            <Button variant="secondary" onClick={() => void upload.refetch()}>
              Try again
            </Button>
          )}
          <Button variant="secondary" onClick={onStartOver}>
            Choose another photo
          </Button>
        </div>
      </Notice>
    );
  }

  const status = data?.status;
  const lostTouch = upload.isError && (
    <Notice tone="error" title="We lost touch with the server while checking your photo" live>
      <p>{errorMessage(upload.error)}</p>
      <Button variant="secondary" className="mt-3" onClick={() => void upload.refetch()}>
        Check again
      </Button>
    </Notice>
  );

  if (!lastReady) {
    if (status === "failed") {
      return (
        <div className="flex flex-col gap-6">
          <Notice tone="error" title="We could not read the strip in this photo" live>
            <p data-testid="upload-failed-message">{data?.error?.message ?? "The photo could not be analysed."}</p>
            <p className="mt-2">
              Try another photo: the whole white card in the frame, daylight, no flash.{" "}
              <Link to="/help">How to photograph a strip</Link>
            </p>
          </Notice>
          <div>
            <Button onClick={onStartOver}>Choose another photo</Button>
          </div>
        </div>
      );
    }
    return (
      <div className="flex flex-col gap-4">
        {lostTouch}
        <AnalysingProgress />
      </div>
    );
  }

  const { analysis } = lastReady;
  const processing = status === "processing";
  const rerunFailed = status === "failed";
  const blockedReason = processing
    ? "Wait a moment: the photo is being analysed again."
    : rerunFailed
      ? "The last analysis did not work, so the strip cannot be posted yet. Tap a clean patch of white paper again, or go back to the automatic paper white."
      : null;

  const several = readings.length > 1;
  // Outlines can be moved once the analysis gives them (not on photos analysed before outlines).
  const outlined = readings.every((r) => r.outline !== null) ? (readings as StripReading[]) : null;
  const photoMode: PhotoMode = outlined ? (mode ?? (several ? "outlines" : "white")) : "white";
  const busy = processing || reanalyse.isPending;
  const alt = several ? `Your photo of ${readings.length} blended strips` : stripAlt(inks.map((i) => i.name));

  const photoSection = (
    <PostPhotoSection
      upload={lastReady}
      status={status}
      errorMessage={data?.error?.message}
      lostTouch={lostTouch}
      alt={alt}
      white={white}
      readyWhite={readyWhite}
      onSetWhite={setWhitePoint}
      busy={busy}
      onStartOver={onStartOver}
      above={
        outlined && (
          <SegmentedChoice
            legend="What tapping the photo does"
            caption="On the photo:"
            options={[
              { value: "outlines", label: several ? "Strip outlines" : "Strip outline" },
              { value: "white", label: "Paper white" },
            ]}
            value={photoMode}
            onChange={setMode}
          />
        )
      }
      photo={
        outlined && photoMode === "outlines" ? (
          <StripOutlinesPanel uploadId={uploadId} images={lastReady.images} alt={alt} strips={outlined} locked={drafts.flatMap((d, i) => (d.posted ? [i] : []))} busy={busy} onChanged={() => setBatchResults(null)} />
        ) : undefined
      }
      below={<AnalysisNotices photo={analysis.notices ?? []} strips={readings} paperMissing={!analysis.paper.found} />}
    />
  );

  if (several) {
    const left = drafts.filter((d) => !d.posted).length;
    return (
      <div className="flex flex-col gap-10">
        {photoSection}
        {batchResults && <BatchPostedSummary results={batchResults} memberId={me.id} left={left} onAnother={onStartOver} />}
        <BatchPostForm
          uploadId={uploadId}
          strips={readings}
          drafts={drafts}
          onDraftsChange={setDrafts}
          inkColour={inkColour}
          picker={picker}
          blockedReason={blockedReason}
          onPosted={setBatchResults}
        />
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-10">
      {photoSection}
      <PostBandsSection
        analysis={analysis}
        remeasured={remeasured}
        inkColour={inkColour}
        chosenIds={inks.map((i) => i.id)}
        onUse={applySuggestion}
        disabled={processing}
      />

      <PostStripForm
        uploadId={uploadId}
        orientation={analysis.orientation}
        inks={inks}
        onInksChange={changeInks}
        inkColour={inkColour}
        picker={picker}
        blockedReason={blockedReason}
        alreadyPostedHint={
          <p className="text-ink-soft">
            <Link to={`/members/${me.id}`} className="font-bold text-accent underline">
              See your strips
            </Link>{" "}
            or{" "}
            <button type="button" onClick={onStartOver} className="font-bold text-accent underline">
              post another photo
            </button>
            .
          </p>
        }
        onPosted={onPosted}
      />
    </div>
  );
}

