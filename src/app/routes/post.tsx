import { useEffect, useRef, useState, type ReactNode } from "react";
import { useStash } from "../../features/stash/api/get-stash";
import { Link, useNavigate, useSearchParams } from "react-router";
import type { Me } from "../../../shared/schemas/accounts";
import type { AnalysisBand, InkSuggestion, Upload } from "../../../shared/schemas/uploads";
import { Button, ButtonLink } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { ColourSwatch } from "../../components/ui/colour-swatch";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { toast } from "../../components/ui/toast";
import { useMe } from "../../features/accounts/api/get-me";
import { useInksById } from "../../features/inks/api/get-inks-by-id";
import { InkPicker } from "../../features/inks/components/ink-picker";
import type { CreatedStrip } from "../../features/strips/api/create-strip";
import { useUpload } from "../../features/strips/api/get-upload";
import { useReanalyseUpload } from "../../features/strips/api/reanalyse-upload";
import { useUploadPhoto, type UploadProgress } from "../../features/strips/api/upload-photo";
import { AnalysedPhoto, type WhitePoint } from "../../features/strips/components/analysed-photo";
import { AnalysisBands } from "../../features/strips/components/analysis-bands";
import { PostStripForm } from "../../features/strips/components/post-strip-form";
import { photoProblem, UploadChooser } from "../../features/strips/components/upload-chooser";
import { AnalysingProgress, SendingProgress } from "../../features/strips/components/upload-progress";
import { prefillInks, withSuggestion, type InkChoice, type InkColourLookup, type InkPickerSlot } from "../../features/strips/ink-choice";
import { refusalText } from "../../features/strips/upload-refusal";
import { directionWords, stripAlt } from "../../features/strips/strip-words";
import { errorMessage, isApiError } from "../../lib/api-client";
import { colourWords } from "../../lib/colour-words";
import { formatHex, plural } from "../../lib/format";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

type ReadyUpload = Upload & { analysis: NonNullable<Upload["analysis"]>; images: NonNullable<Upload["images"]> };

function isReady(upload: Upload | undefined): upload is ReadyUpload {
  return upload?.status === "ready" && upload.analysis !== undefined && upload.images !== undefined;
}

/** A local preview of the photo being sent (blob: URL), released when no longer shown. */
function usePreviewUrl() {
  const [url, setUrl] = useState<string | null>(null);
  const current = useRef<string | null>(null);
  useEffect(() => () => {
    if (current.current) URL.revokeObjectURL(current.current);
  }, []);
  function show(file: File | null) {
    if (current.current) URL.revokeObjectURL(current.current);
    current.current = file ? URL.createObjectURL(file) : null;
    setUrl(current.current);
  }
  return [url, show] as const;
}

function VisitorPrompt() {
  return (
    <>
      <PageHeader documentTitle="Post a strip" title="Post a strip" intro="Share a dried blended strip with its inks, in order." />
      <Card className="max-w-xl space-y-4">
        <h2 className="text-xl font-bold">Sign in to post a strip</h2>
        <p className="text-ink-soft">
          Posting needs a Blendwell account, so others can see who made each strip. Signing in with a link by e-mail
          creates your account the first time.
        </p>
        <div className="flex flex-wrap gap-3">
          <ButtonLink to={`/sign-in?next=${encodeURIComponent("/post")}`}>Sign in to post</ButtonLink>
          <ButtonLink to="/help" variant="secondary">
            How to photograph a strip
          </ButtonLink>
        </div>
      </Card>
    </>
  );
}

function PhotoTips() {
  return (
    <Card className="space-y-3">
      <h2 className="text-xl font-bold">For a good reading</h2>
      <ul className="list-disc space-y-1 pl-5 text-ink-soft">
        <li>Daylight or a daylight lamp; no flash.</li>
        <li>The whole white card in the frame, with paper showing all round the strip.</li>
        <li>Hold the phone flat above the card, parallel to it.</li>
        <li>Only dried ink: it looks different wet.</li>
      </ul>
      <p>
        <Link to="/help" className="font-bold text-accent underline">
          More on photographing a strip, and on working safely
        </Link>
      </p>
    </Card>
  );
}

/** Step one: choose the photo and send it, with the bytes sent shown as they go. */
function ChooseStage({ onUploaded }: { onUploaded: (id: string) => void }) {
  const uploadPhoto = useUploadPhoto();
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [problem, setProblem] = useState<{ title: string; body: string; canRetry: boolean } | null>(null);
  const abort = useRef<AbortController | null>(null);
  const [preview, showPreview] = usePreviewUrl();

  useEffect(() => () => abort.current?.abort(), []);

  async function send(chosen: File) {
    setProblem(null);
    const local = photoProblem(chosen);
    if (local) {
      setProblem({ title: "This photo cannot be used", body: local, canRetry: false });
      return;
    }
    setFile(chosen);
    showPreview(chosen);
    setProgress({ loaded: 0, total: chosen.size });
    const controller = new AbortController();
    abort.current = controller;
    try {
      const accepted = await uploadPhoto.mutateAsync({ file: chosen, onProgress: setProgress, signal: controller.signal });
      onUploaded(accepted.id);
    } catch (error) {
      showPreview(null);
      if (error instanceof DOMException && error.name === "AbortError") {
        setProblem({ title: "Upload cancelled", body: "Nothing was sent. Choose the photo again when you are ready.", canRetry: true });
        return;
      }
      const retryable = isApiError(error) && (error.status === 0 || error.status === 503 || error.status >= 500 || error.status === 429);
      setProblem({ ...refusalText(error), canRetry: retryable });
    }
  }

  if (uploadPhoto.isPending && file) {
    return (
      <div className="flex flex-col gap-4">
        {preview && (
          <img
            src={preview}
            alt="The photo being sent"
            className="max-h-56 w-auto self-start rounded-md border border-rule object-contain"
            onError={(e) => (e.currentTarget.hidden = true)}
          />
        )}
        <SendingProgress progress={progress} fileName={file.name} onCancel={() => abort.current?.abort()} />
      </div>
    );
  }

  const problemNotice: ReactNode = problem && (
    <Notice tone={problem.title === "Upload cancelled" ? "info" : "error"} title={problem.title} live>
      <p>{problem.body}</p>
      {problem.canRetry && file && (
        <Button variant="secondary" className="mt-3" onClick={() => void send(file)}>
          Try again with the same photo
        </Button>
      )}
    </Notice>
  );

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start">
      <UploadChooser onFile={(f) => void send(f)} problem={problemNotice} />
      <PhotoTips />
    </div>
  );
}

function PostedPending({ result, onAnother }: { result: CreatedStrip; onAnother: () => void }) {
  const heading = useRef<HTMLHeadingElement>(null);
  // The form this replaces had the focus; start screen readers and keyboards at the news.
  useEffect(() => heading.current?.focus(), []);
  return (
    <Card className="max-w-2xl space-y-4" data-testid="posted-pending">
      <div aria-hidden="true" className="blend-ornament h-2 w-24 rounded-full" />
      <h2 ref={heading} tabIndex={-1} className="text-2xl font-bold">
        Your strip is waiting for review by a moderator
      </h2>
      <p className="text-ink-soft">
        New members' strips are checked by a moderator before everyone can see them. Until then, only you and the
        moderators can see it; you will find it under “Your strips”.
      </p>
      <div className="flex flex-wrap gap-3">
        <ButtonLink to={`/strips/${result.id}`}>See your strip</ButtonLink>
        <Button variant="secondary" onClick={onAnother}>
          Post another strip
        </Button>
      </div>
    </Card>
  );
}

/** Step two: the analysed photo, the member's ink order and details, and posting. */
function UploadStage({ uploadId, me, onStartOver }: { uploadId: string; me: Me; onStartOver: () => void }) {
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

  // Each fresh "ready" answer replaces the photo and bands; the ink order follows it until the
  // member has changed it.
  const data = upload.data;
  if (isReady(data) && data !== lastReady) {
    if (lastReady && inksTouched) setRemeasured(true);
    else setInks(prefillInks(data.analysis.bands));
    setLastReady(data);
    setReadyWhite(white);
  }

  const suggestionIds = lastReady ? lastReady.analysis.bands.flatMap((b) => b.suggestions.map((s) => s.inkId)) : [];
  // The member's own inks come first in the picker.
  const stash = useStash();
  const stashIds = new Set(stash.data?.map((i) => i.ink.id));
  const catalogue = useInksById([...suggestionIds, ...inks.map((i) => i.id)]);
  const inkColour: InkColourLookup = (id) => {
    const ink = catalogue.get(id);
    return ink ? { hex: ink.hex, lab: ink.lab } : undefined;
  };

  const picker: InkPickerSlot = ({ onPick, chosenIds, disabled }) => (
    <InkPicker
      chosenIds={chosenIds}
      disabled={disabled}
      hint="Type part of an ink's name. It is added at the end; move it into place."
      stashInkIds={stashIds}
      onPick={(ink) => onPick({ id: ink.id, name: ink.name, brand: ink.brand.name, hex: ink.hex, lab: ink.lab })}
    />
  );

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

  return (
    <div className="flex flex-col gap-10">
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
            <p data-testid="rerun-failed-message">{data?.error?.message ?? "The photo could not be analysed with that point."}</p>
            <p className="mt-2">
              Your photo is kept. Tap a clean patch of white paper beside the strip (not on the ink), or go back to the
              automatic paper white.
            </p>
          </Notice>
        )}
        <AnalysedPhoto
          upload={lastReady}
          alt={stripAlt(inks.map((i) => i.name))}
          white={white}
          onSetWhite={setWhitePoint}
          busy={processing || reanalyse.isPending}
        />
        <div id="white-point-help" className="flex flex-col gap-3 text-ink-soft">
          <p>
            <strong className="text-ink">Colours look off?</strong> Tap or click a clean patch of white paper beside the
            strip: we correct the colours against it and find the bands again.
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
              <Button variant="secondary" onClick={() => setWhitePoint(null)} disabled={processing || reanalyse.isPending}>
                Use the automatic paper white
              </Button>
            </div>
          )}
        </div>
      </section>

      <section aria-labelledby="bands-title" className="flex flex-col gap-4">
        <div className="space-y-1">
          <h2 id="bands-title" className="text-2xl font-bold">
            Bands found
          </h2>
          <p className="text-ink-soft">
            We found {plural(analysis.bands.length, "band")}, {directionWords(analysis.orientation)}. Each shows its
            measured colour and the catalogue inks nearest to it (ΔE2000: the smaller, the closer).
          </p>
        </div>
        {remeasured && (
          <Notice tone="info" title="The bands were measured again">
            <p>Your ink order is kept as you left it. Check it against the new suggestions below.</p>
          </Notice>
        )}
        <AnalysisBands
          bands={analysis.bands}
          orientation={analysis.orientation}
          inkColour={inkColour}
          chosenIds={inks.map((i) => i.id)}
          onUse={applySuggestion}
          disabled={processing}
        />
      </section>

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

function SuspendedNotice({ me }: { me: Me }) {
  const [now] = useState(() => Date.now());
  if (!me.suspendedUntil || Date.parse(me.suspendedUntil) <= now) return null;
  return (
    <Notice tone="warning" title="Your account is suspended for now" className="mb-6">
      <p>Until {new Date(me.suspendedUntil).toLocaleDateString("en-GB")} you can browse, but strips you post will be refused.</p>
    </Notice>
  );
}

export default function PostPage() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const raw = params.get("upload");
  const uploadId = raw && UUID.test(raw) ? raw.toLowerCase() : null;

  if (me.isPending) return <Loading label="Checking who is signed in…" />;
  if (me.isError) {
    return (
      <Notice tone="error" title="We could not check who is signed in" live>
        <p>{errorMessage(me.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void me.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (!me.data) return <VisitorPrompt />;

  return (
    <>
      <PageHeader
        documentTitle="Post a strip"
        title="Post a strip"
        intro={
          uploadId
            ? "Check the bands, confirm the inks in order, and add a few details."
            : "Photograph your dried strip on its white card, or choose a photo you already have."
        }
      />
      <SuspendedNotice me={me.data} />
      {uploadId ? (
        <UploadStage key={uploadId} uploadId={uploadId} me={me.data} onStartOver={() => setParams({})} />
      ) : (
        <ChooseStage onUploaded={(id) => setParams({ upload: id })} />
      )}
    </>
  );
}
