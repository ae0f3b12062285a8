export const stashKeys = {
  all: ["stash"] as const,
  mine: () => [...stashKeys.all, "mine"] as const,
  /** Catalogue inks matching a type-ahead, as the stash's "add an ink" box asks for them. */
  catalogue: (q: string) => [...stashKeys.all, "catalogue", q] as const,
};
