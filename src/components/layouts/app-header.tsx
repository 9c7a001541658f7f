import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import type { NavItem } from "@/config/navigation.ts";
import { MainNav } from "./main-nav.tsx";
import { MobileMenu } from "./mobile-menu.tsx";
import { UserMenu, type HeaderUser } from "./user-menu.tsx";
import { Wordmark } from "./wordmark.tsx";

type AppHeaderProps = {
  items: readonly NavItem[];
  user: HeaderUser;
  homeHref: string;
  onSignOut: () => void;
  signingOut: boolean;
  /** Controls beside the user menu, e.g. the notifications bell (composed by the layout). */
  tools?: ReactNode;
};

export function AppHeader({ items, user, homeHref, onSignOut, signingOut, tools }: AppHeaderProps) {
  return (
    <header className="relative bg-ink-900 text-white">
      <div className="mx-auto flex h-16 max-w-7xl items-center gap-6 px-4 sm:px-6">
        <Link
          to={homeHref}
          className="rounded-md focus-visible:outline-2 focus-visible:outline-offset-4 focus-visible:outline-accent-400"
        >
          <Wordmark />
        </Link>
        <nav aria-label="Main" className="hidden flex-1 xl:block">
          <MainNav items={items} layout="bar" />
        </nav>
        <div className="ml-auto flex items-center gap-2">
          {tools}
          <div className="hidden xl:block">
            <UserMenu user={user} onSignOut={onSignOut} signingOut={signingOut} />
          </div>
          <div className="xl:hidden">
            <MobileMenu items={items} user={user} onSignOut={onSignOut} signingOut={signingOut} />
          </div>
        </div>
      </div>
    </header>
  );
}
