export const binderKeys = {
  all: ["binders"] as const,
  lists: () => [...binderKeys.all, "list"] as const,
  mine: () => [...binderKeys.lists(), "mine"] as const,
  member: (memberId: string) => [...binderKeys.lists(), "member", memberId] as const,
  details: () => [...binderKeys.all, "detail"] as const,
  detail: (id: number) => [...binderKeys.details(), id] as const,
  /** Which of my binders hold a strip (the save button's checks). */
  savedIn: (stripId: number) => [...binderKeys.all, "saved-in", stripId] as const,
  /** Mutation key shared by a binder's reorders, so they run one after another. */
  order: (id: number) => [...binderKeys.detail(id), "order"] as const,
};
