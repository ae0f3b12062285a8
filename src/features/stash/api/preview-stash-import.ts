import { useMutation } from "@tanstack/react-query";
import type { StashImportPreview } from "../../../../shared/schemas/stash";
import { api } from "../../../lib/api-client";

/** POST /api/stash/import: one CSV file in the multipart field `file`. Reads it; saves nothing. */
export function previewStashImport(file: File): Promise<StashImportPreview> {
  const body = new FormData();
  body.append("file", file, file.name);
  return api.post<StashImportPreview>("/api/stash/import", body);
}

export function usePreviewStashImport() {
  return useMutation({
    mutationFn: previewStashImport,
    meta: { errorsShownInline: true },
  });
}
