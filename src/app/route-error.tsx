import { isRouteErrorResponse, Link, useRouteError } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { isApiError } from "@/lib/api-client.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";

function describe(error: unknown): { title: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    if (error.status === 403) return { title: "Not available to you", detail: String(error.data) };
    if (error.status === 404) return { title: "Page not found", detail: "There is nothing at this address." };
    return { title: "Something went wrong", detail: `The page answered ${error.status}.` };
  }
  if (isApiError(error)) {
    if (error.status === 0 || error.code === "unavailable")
      return { title: "Clearbench cannot be reached", detail: error.message };
    return { title: "Something went wrong", detail: error.message };
  }
  // A chunk that fails to load after a new deploy lands here too; reloading fetches the new one.
  return { title: "Something went wrong", detail: "This page could not be shown. Reload to try again." };
}

/**
 * Error screen for any route; the detail never includes a stack trace. Inside the signed-in layout
 * it renders without its own <main>, since the layout already has one.
 */
export function RouteError({ inLayout = false }: { inLayout?: boolean }) {
  const { title, detail } = describe(useRouteError());
  const Wrapper = inLayout ? "div" : "main";
  return (
    <Wrapper className={inLayout ? "max-w-xl py-6" : "mx-auto max-w-xl px-4 py-16"}>
      <title>{`${title} · Clearbench`}</title>
      <h1 className="text-2xl font-semibold text-ink-900">{title}</h1>
      <p className="mt-2 text-ink-700">{detail}</p>
      <div className="mt-6 flex flex-wrap gap-3">
        <button type="button" className={buttonStyles("secondary")} onClick={() => window.location.reload()}>
          Reload
        </button>
        <Link to={paths.home} className={buttonStyles("quiet")}>
          Go to your start page
        </Link>
      </div>
    </Wrapper>
  );
}
