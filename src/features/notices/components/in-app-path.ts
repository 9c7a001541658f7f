/**
 * Notification links are written for e-mail, as absolute URLs on the configured public address. In the app
 * only the path matters: the public address may name another host (localhost, a proxy) than the one in use.
 */
export function inAppPath(link: string): string {
  try {
    const url = new URL(link, window.location.origin);
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return link;
  }
}
