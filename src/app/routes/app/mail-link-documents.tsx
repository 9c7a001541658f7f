import { mailLinkLoader } from "./mail-link-loader.ts";

export const loader = mailLinkLoader("documents");

export function Component() {
  return null;
}
