import { useEffect, useRef, useState, type ReactNode } from "react";
import { Link } from "react-router";
import { Button } from "../../../components/ui/button";
import { Card } from "../../../components/ui/card";
import { Notice } from "../../../components/ui/notice";
import { isApiError } from "../../../lib/api-client";
import { useUploadPhoto, type UploadProgress } from "../api/upload-photo";
import { refusalText } from "../upload-refusal";
import { photoProblem, UploadChooser } from "./upload-chooser";
import { SendingProgress } from "./upload-progress";

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
export function ChooseStage({ onUploaded }: { onUploaded: (id: string) => void }) {
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

