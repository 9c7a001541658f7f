import { Outlet } from "react-router-dom";
import { Wordmark } from "@/components/layouts/wordmark.tsx";
import { RouteError } from "../../route-error.tsx";

/** Frame for the public pages: the product name above one calm card. */
export function Component() {
  return (
    <div className="flex min-h-dvh flex-col bg-paper">
      <header className="bg-ink-900">
        <div className="mx-auto flex h-16 max-w-5xl items-center px-4">
          <Wordmark />
        </div>
      </header>
      <main className="flex-1 px-4 py-10 sm:py-16">
        <Outlet />
      </main>
    </div>
  );
}

export function ErrorBoundary() {
  return <RouteError />;
}
