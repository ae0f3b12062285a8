import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { InkImportResult } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { brandKeys, inkKeys } from "./keys";

/** POST /api/inks/import: one CSV file in the multipart field `file`. */
export function importCatalogue(file: File): Promise<InkImportResult> {
  const body = new FormData();
  body.append("file", file, file.name);
  return api.post<InkImportResult>("/api/inks/import", body);
}

export function useImportCatalogue() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importCatalogue,
    meta: { errorsShownInline: true },
    onSuccess: () => {
      // An import can touch any ink and any brand.
      void queryClient.invalidateQueries({ queryKey: inkKeys.all });
      void queryClient.invalidateQueries({ queryKey: brandKeys.all });
    },
  });
}
