import { ApiError, isApiError } from "../../lib/api-client";

/**
 * Splits the server's field problems into those about the ink order (`inks`, `inks.0`, …),
 * shown beside the ink order, and the rest, left on the error for the form's own fields.
 */
export function splitInkErrors(error: unknown): { inkProblem: string | null; rest: unknown } {
  if (!isApiError(error) || !error.fields) return { inkProblem: null, rest: error };
  const inkMessages: string[] = [];
  const others: Record<string, string[]> = {};
  for (const [key, messages] of Object.entries(error.fields)) {
    const name = key.replace(/^(body|query|params)\./, "");
    if (name === "inks" || name.startsWith("inks.")) inkMessages.push(...messages);
    else others[key] = messages;
  }
  const rest = new ApiError(error.status, error.code, error.message, Object.keys(others).length ? others : undefined);
  return { inkProblem: inkMessages.length ? inkMessages.join(" ") : null, rest };
}

/** "Ink order: an ink is listed twice" reads better as a sentence about the ink order. */
export function inkOrderProblemText(message: string): string {
  const text = message.trim();
  if (/^(name|at most|an ink|unknown|must)/i.test(text)) return `Ink order: ${text}.`.replace(/\.\.$/, ".");
  return text;
}
