import { MutationCache, QueryCache, QueryClient } from "@tanstack/react-query";
import { isApiError } from "./api-client";

declare module "@tanstack/react-query" {
  interface Register {
    mutationMeta: {
      /** The component shows this mutation's errors itself (a form, inline); skip the toast. */
      errorsShownInline?: boolean;
    };
    queryMeta: {
      /** The component shows this query's errors even on a background refetch. */
      errorsShownInline?: boolean;
    };
  }
}

export type QueryClientHooks = {
  /** Called for every error no component has promised to show (the app shows a toast). */
  onUnhandledError: (error: unknown) => void;
};

function isClientError(error: unknown): boolean {
  return isApiError(error) && error.status >= 400 && error.status < 500;
}

export function createQueryClient({ onUnhandledError }: QueryClientHooks): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({
      // A first load shows its error on the page; a failed refetch of data already on screen
      // would otherwise go unnoticed.
      onError: (error, query) => {
        if (query.meta?.errorsShownInline) return;
        if (query.state.data !== undefined) onUnhandledError(error);
      },
    }),
    mutationCache: new MutationCache({
      onError: (error, _variables, _context, mutation) => {
        if (mutation.meta?.errorsShownInline) return;
        onUnhandledError(error);
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // 4xx answers will not change by asking again.
        retry: (count, error) => !isClientError(error) && count < 2,
        refetchOnWindowFocus: false,
      },
      mutations: { retry: false },
    },
  });
}
