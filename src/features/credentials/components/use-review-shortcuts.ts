import { useEffect, useLayoutEffect, useRef } from "react";

const isTyping = (target: EventTarget | null): boolean =>
  target instanceof HTMLElement &&
  (target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName));

/** Single-key shortcuts for the review page; they stay quiet while someone types in a field or holds a modifier. */
export function useReviewShortcuts(
  enabled: boolean,
  handlers: { verify: () => void; focusReturn: () => void },
) {
  const latest = useRef(handlers);
  // The listener is added once; it calls whatever handlers the last render gave (they close over the form's values).
  useLayoutEffect(() => {
    latest.current = handlers;
  });
  useEffect(() => {
    if (!enabled) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.defaultPrevented || event.repeat || event.ctrlKey || event.metaKey || event.altKey) return;
      if (isTyping(event.target)) return;
      const key = event.key.toLowerCase();
      if (key === "v") {
        event.preventDefault();
        latest.current.verify();
      } else if (key === "r") {
        event.preventDefault();
        latest.current.focusReturn();
      }
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, [enabled]);
}
