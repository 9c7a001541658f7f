import type { ReactNode } from "react";
import { PageHeader } from "./page-header.tsx";

type PlaceholderPageProps = {
  title: string;
  /** What this page will hold once it is built. */
  purpose: ReactNode;
  children?: ReactNode;
};

/** Stands in for a page another part of the work will deliver; names the page and what it is for. */
export function PlaceholderPage({ title, purpose, children }: PlaceholderPageProps) {
  return (
    <>
      <PageHeader title={title} description={purpose} />
      <div className="rounded-lg border border-ink-100 bg-white px-5 py-4 text-sm text-ink-700">
        <p>This page is being built. The navigation already lists everything your role can use.</p>
      </div>
      {children && <div className="mt-6 space-y-6">{children}</div>}
    </>
  );
}
