import { useCallback, useId, useRef, useState } from "react";
import { Link } from "react-router-dom";
import type { Role } from "@shared/accounts/schemas.ts";
import { paths } from "@/config/paths.ts";
import { roleLabels } from "@/config/navigation.ts";
import { useDismiss } from "./use-dismiss.ts";

export type HeaderUser = { name: string; email: string; companyName: string; role: Role };

type UserMenuProps = { user: HeaderUser; onSignOut: () => void; signingOut: boolean };

const initialsOf = (name: string) =>
  name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((part) => part[0]?.toUpperCase())
    .join("");

/** Who is signed in, a link to the account page and the sign-out button, behind one disclosure button. */
export function UserMenu({ user, onSignOut, signingOut }: UserMenuProps) {
  const [open, setOpen] = useState(false);
  const close = useCallback(() => setOpen(false), []);
  const root = useRef<HTMLDivElement>(null);
  const panelId = useId();
  useDismiss(root, open, close);

  return (
    <div ref={root} className="relative">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
        className="flex items-center gap-2 rounded-md px-2 py-1.5 text-sm text-ink-50 hover:bg-ink-800 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-400"
      >
        <span
          aria-hidden="true"
          className="grid size-8 place-items-center rounded-full bg-ink-700 text-xs font-semibold"
        >
          {initialsOf(user.name)}
        </span>
        <span className="sr-only">User menu for </span>
        {/* The name shows beside the initials only where the widest bar (a shop's ten pages) leaves room. */}
        <span className="sr-only 2xl:not-sr-only 2xl:max-w-40 2xl:truncate">{user.name}</span>
        <svg viewBox="0 0 10 6" className="size-2.5" aria-hidden="true" focusable="false">
          <path d="m1 1 4 4 4-4" className="fill-none stroke-current" strokeWidth="1.5" />
        </svg>
      </button>
      {open && (
        <div
          id={panelId}
          className="absolute right-0 z-20 mt-2 w-72 rounded-lg border border-ink-100 bg-white p-2 text-ink-900 shadow-lg"
        >
          <div className="border-b border-ink-100 px-3 pt-1 pb-3 text-sm">
            <p className="font-semibold">{user.name}</p>
            <p className="truncate text-ink-700">{user.email}</p>
            <p className="mt-1 text-ink-700">
              {roleLabels[user.role]} · {user.companyName}
            </p>
          </div>
          <Link
            to={paths.account}
            onClick={close}
            className="mt-1 flex min-h-10 items-center rounded-md px-3 text-sm hover:bg-ink-50 focus-visible:outline-2 focus-visible:outline-ink-700"
          >
            Account
          </Link>
          <button
            type="button"
            onClick={onSignOut}
            disabled={signingOut}
            className="flex min-h-10 w-full items-center rounded-md px-3 text-left text-sm hover:bg-ink-50 focus-visible:outline-2 focus-visible:outline-ink-700 disabled:opacity-60"
          >
            {signingOut ? "Signing out…" : "Sign out"}
          </button>
        </div>
      )}
    </div>
  );
}
