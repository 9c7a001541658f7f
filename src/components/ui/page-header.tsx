import type { ReactNode } from "react";

type PageHeaderProps = {
  title: string;
  description?: ReactNode;
  /** Buttons or links on the right. */
  actions?: ReactNode;
};

/** The page's one h1; also sets the document title (React 19 hoists <title> into <head>). */
export function PageHeader({ title, description, actions }: PageHeaderProps) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-ink-100 pb-4">
      <title>{`${title} · Clearbench`}</title>
      <div className="min-w-0">
        <h1 className="text-2xl font-semibold tracking-tight text-ink-900">{title}</h1>
        {description && <div className="mt-1 max-w-prose text-ink-700">{description}</div>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </div>
  );
}
