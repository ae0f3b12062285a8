import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Brand } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { brandKeys } from "./keys";

export function createBrand(name: string): Promise<Brand> {
  return api.post<Brand>("/api/brands", { name });
}

export function useCreateBrand() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBrand,
    meta: { errorsShownInline: true },
    onSuccess: (brand) => {
      queryClient.setQueryData<Brand[]>(brandKeys.list(), (old) =>
        old && !old.some((b) => b.id === brand.id) ? [...old, brand] : old,
      );
      void queryClient.invalidateQueries({ queryKey: brandKeys.list() });
    },
  });
}
