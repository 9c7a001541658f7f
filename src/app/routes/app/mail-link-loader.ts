import { redirect, type LoaderFunctionArgs } from "react-router-dom";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { queryClient } from "@/lib/query-client.ts";
import { mailLinkTarget, type MailLink } from "./mail-link-target.ts";

/** Loader for a link from an e-mail: signed in already (the parent route sees to that), so send the user on. */
export const mailLinkLoader =
  (link: MailLink) =>
  async ({ request }: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData(currentUserQuery());
    if (!user) return null;
    return redirect(mailLinkTarget(link, user.role, new URL(request.url).search));
  };
