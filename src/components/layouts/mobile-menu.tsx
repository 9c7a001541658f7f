import { useCallback, useId, useRef, useState } from "react";
import { Link, useLocation } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { roleLabels, type NavItem } from "@/config/navigation.ts";
import { MainNav } from "./main-nav.tsx";
import type { HeaderUser } from "./user-menu.tsx";
import { useDismiss } from "./use-dismiss.ts";

type MobileMenuProps = {
  items: readonly NavItem[];
  user: HeaderUser;
  onSignOut: () => void;
  signingOut: boolean;
};

/** The phone-width menu: every link and the account actions as full-width, 48 px touch targets. */
export function MobileMenu({ items, user, onSignOut, signingOut }: MobileMenuProps) {
  const { pathname } = useLocation();
  // The menu remembers the page it was opened on, so any navigation (a link, Back, a redirect) closes it
  // without an effect that sets state after the render.
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  const close = useCallback(() => setOpenOn(null), []);
  const root = useRef<HTMLDivElement>(null);
  const panelId = useId();
  useDismiss(root, open, close);

  return (
    <div ref={root}>
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpenOn(open ? null : pathname)}
        className="flex min-h-12 min-w-12 items-center justify-center gap-2 rounded-md px-3 text-base font-medium text-ink-50 hover:bg-ink-800 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-400"
      >
        <svg viewBox="0 0 20 16" className="size-5" aria-hidden="true" focusable="false">
          {open ? (
            <path d="m4 2 12 12M16 2 4 14" className="stroke-current" strokeWidth="2" />
          ) : (
            <path d="M2 2h16M2 8h16M2 14h16" className="stroke-current" strokeWidth="2" />
          )}
        </svg>
        Menu
      </button>
      {open && (
        <div
          id={panelId}
          className="absolute inset-x-0 top-full z-20 border-t border-ink-800 bg-ink-900 px-3 pt-2 pb-4 shadow-lg"
        >
          <nav aria-label="Main">
            <MainNav items={items} layout="stack" onNavigate={close} />
          </nav>
          <div className="mt-3 border-t border-ink-700 pt-3">
            <p className="px-4 text-sm text-ink-100">
              {user.name} · {roleLabels[user.role]} · {user.companyName}
            </p>
            <Link
              to={paths.account}
              onClick={close}
              className="mt-1 flex min-h-12 items-center rounded-md px-4 text-lg text-ink-50 hover:bg-ink-800 focus-visible:outline-2 focus-visible:outline-accent-400"
            >
              Account
            </Link>
            <button
              type="button"
              onClick={onSignOut}
              disabled={signingOut}
              className="flex min-h-12 w-full items-center rounded-md px-4 text-left text-lg text-ink-50 hover:bg-ink-800 focus-visible:outline-2 focus-visible:outline-accent-400 disabled:opacity-60"
            >
              {signingOut ? "Signing out…" : "Sign out"}
            </button>
          </div>
        </div>
      )}
    </div>
  );
}
