import type { ReactNode } from "react";

type AuthCardProps = {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
  wide?: boolean;
};

/** The card every public page sits in; its title is the page's h1 and the document title. */
export function AuthCard({ title, intro, children, footer, wide = false }: AuthCardProps) {
  return (
    <div className={`mx-auto ${wide ? "max-w-2xl" : "max-w-md"}`}>
      <title>{`${title} · Clearbench`}</title>
      <div className="rounded-xl border border-ink-100 bg-white px-5 py-6 shadow-sm sm:px-8 sm:py-8">
        <h1 className="text-2xl font-semibold tracking-tight text-ink-900">{title}</h1>
        {intro && <div className="mt-1 text-ink-700">{intro}</div>}
        <div className="mt-6">{children}</div>
      </div>
      {footer && <div className="mt-4 space-y-1 text-center text-sm text-ink-700">{footer}</div>}
    </div>
  );
}
