/** The one error shape every /api route answers with. */
export type ApiErrorBody = {
  error: {
    code: string;
    message: string;
    /** Field (or CSV line) → problems, for forms and imports. */
    fields?: Record<string, string[]>;
  };
};
