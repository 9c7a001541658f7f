import type { ReactNode } from "react";
import { Link } from "react-router-dom";

export function AuthLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link
      to={to}
      className="font-medium text-ink-700 underline underline-offset-2 hover:text-ink-900 focus-visible:outline-2 focus-visible:outline-ink-700"
    >
      {children}
    </Link>
  );
}
