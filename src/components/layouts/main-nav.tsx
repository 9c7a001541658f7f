import { NavLink } from "react-router-dom";
import type { NavItem } from "@/config/navigation.ts";

type MainNavProps = { items: readonly NavItem[]; onNavigate?: () => void; layout: "bar" | "stack" };

// The bar sits in the ink header on wide screens; the stack fills the phone menu with large targets.
const linkStyles = {
  bar:
    "block rounded-md px-3 py-2 text-center text-sm leading-tight font-medium text-ink-100 hover:bg-ink-800 hover:text-white " +
    "aria-[current=page]:bg-ink-700 aria-[current=page]:text-white aria-[current=page]:shadow-[inset_0_-3px_0_var(--color-accent-400)] " +
    "focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-400",
  stack:
    "flex min-h-12 items-center rounded-md px-4 text-lg font-medium text-ink-50 hover:bg-ink-800 " +
    "aria-[current=page]:bg-ink-700 aria-[current=page]:text-white aria-[current=page]:shadow-[inset_4px_0_0_var(--color-accent-400)] " +
    "focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-400",
};

export function MainNav({ items, onNavigate, layout }: MainNavProps) {
  return (
    <ul className={layout === "bar" ? "flex items-center gap-1" : "flex flex-col gap-1"}>
      {items.map((item) => (
        <li key={item.to}>
          {/* `end` keeps a role's home link from staying current on every page below it. */}
          <NavLink to={item.to} end={item.end ?? false} className={linkStyles[layout]} onClick={onNavigate}>
            {item.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}
