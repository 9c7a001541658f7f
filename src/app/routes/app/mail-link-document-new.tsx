import { mailLinkLoader } from "./mail-link-loader.ts";

export const loader = mailLinkLoader("documentNew");

export function Component() {
  return null;
}
