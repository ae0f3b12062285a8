import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { isApiError } from "./api-client";

/**
 * Puts an API error's `fields` beside the form inputs they belong to. Returns the problems that
 * match no input (shown in the form's summary) so that no message the server sent is lost.
 * Keys like "body.lab.l" or "lab.l" both reach the "lab.l" input.
 */
export function applyApiFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly Path<T>[],
): string[] {
  if (!isApiError(error) || !error.fields) return [];
  const leftovers: string[] = [];
  let focused = false;
  for (const [key, messages] of Object.entries(error.fields)) {
    const text = messages.join(" ");
    const name = key.replace(/^(body|query|params)\./, "");
    const match = fieldNames.find((f) => f === name);
    if (match) {
      setError(match, { type: "server", message: text }, { shouldFocus: !focused });
      focused = true;
    } else {
      leftovers.push(name ? `${name}: ${text}` : text);
    }
  }
  return leftovers;
}
