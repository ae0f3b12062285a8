import { paperLabels, toolLabels, type Strip } from "../../../../shared/schemas/strips";

function hostOf(url: string): string | null {
  try {
    return new URL(url).hostname;
  } catch {
    return null;
  }
}

/** Paper, tools and the video link. */
export function StripFacts({ strip }: { strip: Pick<Strip, "paper" | "tools" | "videoUrl"> }) {
  return (
    <dl className="divide-y divide-rule rounded-lg border border-rule bg-card px-4 shadow-card">
      <div className="flex flex-wrap justify-between gap-x-4 py-3">
        <dt className="text-ink-muted">Paper</dt>
        <dd className="font-bold">{paperLabels[strip.paper]}</dd>
      </div>
      <div className="flex flex-wrap justify-between gap-x-4 py-3">
        <dt className="text-ink-muted">Tools</dt>
        <dd className="font-bold">{strip.tools.length ? strip.tools.map((t) => toolLabels[t]).join(", ") : "Not given"}</dd>
      </div>
      {strip.videoUrl && (
        <div className="flex flex-wrap justify-between gap-x-4 py-3">
          <dt className="text-ink-muted">Video</dt>
          <dd className="min-w-0">
            <a
              href={strip.videoUrl}
              rel="nofollow noopener noreferrer"
              target="_blank"
              className="font-bold break-all text-accent underline"
            >
              Watch the blending video<span className="sr-only"> (opens another site in a new tab)</span>
            </a>
            {hostOf(strip.videoUrl) && <span className="block text-sm break-all text-ink-muted">{hostOf(strip.videoUrl)}</span>}
          </dd>
        </div>
      )}
    </dl>
  );
}
