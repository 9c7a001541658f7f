import type { ReactNode } from "react";

type EmptyStateProps = {
  title: string;
  children?: ReactNode;
  /** A next step, e.g. a link or button. */
  action?: ReactNode;
};

export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <div className="rounded-lg border border-dashed border-ink-300 bg-white px-6 py-10 text-center">
      <svg viewBox="0 0 24 24" className="mx-auto size-8 text-ink-300" aria-hidden="true" focusable="false">
        <rect
          x="3.5"
          y="5.5"
          width="17"
          height="13"
          rx="2"
          className="fill-none stroke-current"
          strokeWidth="1.5"
        />
        <path d="M3.5 10h17" className="stroke-current" strokeWidth="1.5" />
      </svg>
      <p className="mt-3 font-semibold text-ink-900">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-prose text-sm text-ink-700">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}
