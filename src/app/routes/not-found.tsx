import { Link } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { Wordmark } from "@/components/layouts/wordmark.tsx";

export function Component() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <title>Page not found · Clearbench</title>
      <Wordmark tone="dark" />
      <h1 className="mt-8 text-2xl font-semibold text-ink-900">Page not found</h1>
      <p className="mt-2 text-ink-700">
        There is nothing at this address. It may have moved, or the link may be mistyped.
      </p>
      <Link to={paths.home} className={`${buttonStyles("primary")} mt-6`}>
        Go to your start page
      </Link>
    </main>
  );
}
