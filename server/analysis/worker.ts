// Worker-thread entry for piscina (run under tsx: `execArgv: ["--import", "tsx"]`).
// Errors cross the thread boundary as plain objects: a structured clone of an Error drops its
// class and `code`, so member-facing failures are returned, not thrown. Bugs still throw.
import { ImageError, type DerivativeInfo } from "../images/index";
import { analyzeStripImage, processStripPhoto } from "./analyze-strip-image";
import { NoStripError } from "./no-strip-error";
import type { AnalysisResult, CatalogueInk } from "./types";

export type AnalysisTask = {
  path: string;
  catalogue: CatalogueInk[];
  stash?: number[];
  white?: { x: number; y: number };
  /** When given, the display and thumbnail WebP files are written there too. */
  derivatives?: { displayPath: string; thumbPath: string };
};

export type AnalysisTaskFailure = { name: "ImageError" | "NoStripError"; code: string; message: string };

export type AnalysisTaskOutcome =
  | { ok: true; result: AnalysisResult; derivatives: DerivativeInfo | null }
  | { ok: false; error: AnalysisTaskFailure };

export default async function runAnalysisTask(task: AnalysisTask): Promise<AnalysisTaskOutcome> {
  const opts = { catalogue: task.catalogue, stash: task.stash ? new Set(task.stash) : undefined, white: task.white };
  try {
    if (task.derivatives) {
      const { analysis, derivatives } = await processStripPhoto(task.path, { ...opts, ...task.derivatives });
      return { ok: true, result: analysis, derivatives };
    }
    return { ok: true, result: await analyzeStripImage(task.path, opts), derivatives: null };
  } catch (err) {
    if (err instanceof ImageError || err instanceof NoStripError) {
      return { ok: false, error: { name: err.name as AnalysisTaskFailure["name"], code: err.code, message: err.message } };
    }
    throw err;
  }
}

/** On the main thread: turns a failed outcome back into the typed error. */
export function rethrowTaskFailure(outcome: AnalysisTaskOutcome): asserts outcome is Extract<AnalysisTaskOutcome, { ok: true }> {
  if (outcome.ok) return;
  const { name, code, message } = outcome.error;
  if (name === "NoStripError") {
    const e = new NoStripError(code as NoStripError["code"]);
    throw e;
  }
  throw new ImageError(code as ImageError["code"], message);
}
