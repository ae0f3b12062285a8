import { useEffect, type ReactNode } from "react";

type PageHeaderProps = {
  title: ReactNode;
  /** Sets the document title: "<title> · Blendwell". */
  documentTitle?: string;
  eyebrow?: ReactNode;
  intro?: ReactNode;
  actions?: ReactNode;
};

/** Sets the tab's title while mounted. (A rendered <title> would lose to index.html's own.) */
export function DocumentTitle({ title }: { title: string }) {
  useEffect(() => {
    document.title = title ? `${title} · Blendwell` : "Blendwell";
  }, [title]);
  return null;
}

export function PageHeader({ title, documentTitle, eyebrow, intro, actions }: PageHeaderProps) {
  return (
    <header className="mb-8 flex flex-col gap-4 border-b border-rule pb-6 sm:flex-row sm:items-end sm:justify-between">
      {documentTitle !== undefined && <DocumentTitle title={documentTitle} />}
      <div className="min-w-0 space-y-2">
        {eyebrow && <p className="text-sm font-bold tracking-wide text-ink-muted uppercase">{eyebrow}</p>}
        <h1 className="text-3xl leading-tight font-bold text-balance sm:text-4xl">{title}</h1>
        {intro && <div className="max-w-prose text-lg text-ink-soft">{intro}</div>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </header>
  );
}
