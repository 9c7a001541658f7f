import { RouteError } from "../../route-error.tsx";

/** Wraps one role's pages so a refusal or failure shows inside the signed-in frame. */
export function ErrorBoundary() {
  return <RouteError inLayout />;
}
