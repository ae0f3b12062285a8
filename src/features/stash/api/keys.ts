export const stashKeys = {
  all: ["stash"] as const,
  mine: () => [...stashKeys.all, "mine"] as const,
};
