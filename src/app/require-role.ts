import { data, redirect, type LoaderFunctionArgs } from "react-router-dom";
import type { Role } from "@shared/accounts/schemas.ts";
import { signInHref } from "@/config/paths.ts";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { queryClient } from "@/lib/query-client.ts";

const pathOf = (request: Request) => {
  const url = new URL(request.url);
  return `${url.pathname}${url.search}`;
};

/** Loader for the signed-in area: nobody signed in goes to sign-in and comes back afterwards. */
export async function requireUser({ request }: LoaderFunctionArgs) {
  const user = await queryClient.ensureQueryData(currentUserQuery());
  if (!user) throw redirect(signInHref(pathOf(request)));
  return user;
}

/**
 * Loader for one role's pages. The server checks every request again; this only keeps people
 * from landing on a screen whose every call would be refused.
 */
export const requireRole =
  (...allowed: Role[]) =>
  async (args: LoaderFunctionArgs) => {
    const user = await requireUser(args);
    if (!allowed.includes(user.role))
      throw data("This page is not part of your role's workspace.", { status: 403 });
    return null;
  };
