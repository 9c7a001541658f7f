import { createElement } from "react";
import { markAttrs, statusMarks, type StatusMeaning } from "@shared/status/status-marks.ts";

const camel = (name: string) => name.replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());

/** The status's one shape, drawn from the shared table that the printed proof uses too. */
export function StatusMark({
  status,
  className = "size-3.5",
}: {
  status: StatusMeaning;
  className?: string;
}) {
  const mark = statusMarks[status];
  return (
    <svg
      viewBox="0 0 16 16"
      className={`${className} shrink-0`}
      aria-hidden="true"
      focusable="false"
      data-shape={mark.shape}
    >
      {mark.elements.map((e, i) =>
        createElement(e.tag, {
          key: i,
          ...Object.fromEntries(Object.entries(markAttrs(mark, e)).map(([k, v]) => [camel(k), v])),
        }),
      )}
    </svg>
  );
}
