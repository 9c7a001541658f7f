/**
 * Every status a person reads, with its one word and its one shape, defined once for the screens and the printed
 * proof. A status is never colour alone: each meaning has a shape no other meaning uses, so a badge reads the same in
 * grey print. The shapes are Clearbench's own; none copies a traffic-light or signal-sign convention.
 */

export const standingStatuses = ["cleared", "lapsing", "not_cleared", "not_checked"] as const;
export const requirementStatuses = ["met", "lapsing", "unmet"] as const;
export const credentialStatuses = ["submitted", "returned", "verified", "superseded", "lapsed"] as const;
export const workOrderStatuses = [
  "requested",
  "accepted",
  "declined",
  "completed",
  "disputed",
  "confirmed",
  "cancelled",
] as const;
/** A machine transfer waits, is accepted or declined like a work order, or is called back: only that last is its own. */
export const machineTransferOnlyStatuses = ["withdrawn"] as const;

export type StatusMeaning =
  | (typeof standingStatuses)[number]
  | (typeof requirementStatuses)[number]
  | (typeof credentialStatuses)[number]
  | (typeof workOrderStatuses)[number]
  | (typeof machineTransferOnlyStatuses)[number];

/** One SVG element of a 16 x 16 mark. `"tone"` stands for the mark's colour, so screens and print share geometry. */
export interface MarkElement {
  tag: "circle" | "path" | "rect";
  attrs: Record<string, string | number>;
}

export interface StatusMark {
  word: string;
  /** What the status means, for the legend. */
  explains: string;
  /** Hex colour of the shape; each keeps at least 3:1 against white (WCAG 1.4.11 non-text contrast). */
  tone: string;
  /** Names the shape in words, for the legend's text and for tests. */
  shape: string;
  elements: readonly MarkElement[];
}

const GREEN = "#047857";
const AMBER = "#b45309";
const RED = "#b91c1c";
const BLUE = "#3d5a8c";
const DEEP_BLUE = "#213a66";
const BROWN = "#9c4f14";

const check = {
  tag: "path",
  attrs: { d: "m5 8.25 2 2 4-4.25", fill: "none", stroke: "white", "stroke-width": 1.75 },
} as const;

export const statusMarks: Record<StatusMeaning, StatusMark> = {
  cleared: {
    word: "Cleared",
    explains: "Every required document is verified and in force today",
    tone: GREEN,
    shape: "filled circle",
    elements: [{ tag: "circle", attrs: { cx: 8, cy: 8, r: 6, fill: "tone" } }],
  },
  lapsing: {
    word: "Lapsing",
    explains: "In force today; a required document lapses soon",
    tone: AMBER,
    shape: "hourglass",
    elements: [{ tag: "path", attrs: { d: "M3.5 2.5h9L8 8l4.5 5.5h-9L8 8z", fill: "tone" } }],
  },
  not_cleared: {
    word: "Not cleared",
    explains: "A required document is missing, unverified or lapsed",
    tone: RED,
    shape: "open square",
    elements: [
      {
        tag: "rect",
        attrs: {
          x: 2.75,
          y: 2.75,
          width: 10.5,
          height: 10.5,
          fill: "none",
          stroke: "tone",
          "stroke-width": 2,
        },
      },
    ],
  },
  not_checked: {
    word: "Not yet checked",
    explains: "Standing has not been worked out yet; it is after the first document is decided",
    tone: BLUE,
    shape: "ring with a dash",
    elements: [
      { tag: "circle", attrs: { cx: 8, cy: 8, r: 5.5, fill: "none", stroke: "tone", "stroke-width": 1.5 } },
      { tag: "path", attrs: { d: "M5 8h6", fill: "none", stroke: "tone", "stroke-width": 1.75 } },
    ],
  },
  met: {
    word: "Met",
    explains: "This requirement is met by a verified document in force",
    tone: GREEN,
    shape: "ring with a dot",
    elements: [
      { tag: "circle", attrs: { cx: 8, cy: 8, r: 5.5, fill: "none", stroke: "tone", "stroke-width": 1.5 } },
      { tag: "circle", attrs: { cx: 8, cy: 8, r: 2.5, fill: "tone" } },
    ],
  },
  unmet: {
    word: "Not met",
    explains: "No verified document in force meets this requirement",
    tone: RED,
    shape: "square with a bar",
    elements: [
      {
        tag: "rect",
        attrs: {
          x: 2.75,
          y: 2.75,
          width: 10.5,
          height: 10.5,
          fill: "none",
          stroke: "tone",
          "stroke-width": 1.5,
        },
      },
      { tag: "path", attrs: { d: "M5 8h6", fill: "none", stroke: "tone", "stroke-width": 2 } },
    ],
  },
  submitted: {
    word: "Awaiting verification",
    explains: "Uploaded; a reviewer has not decided yet, so it does not count",
    tone: BLUE,
    shape: "dashed ring",
    elements: [
      {
        tag: "circle",
        attrs: {
          cx: 8,
          cy: 8,
          r: 5.25,
          fill: "none",
          stroke: "tone",
          "stroke-width": 1.75,
          "stroke-dasharray": "2.5 2",
        },
      },
    ],
  },
  returned: {
    word: "Returned",
    explains: "Sent back by a reviewer with a reason; correct it or upload again",
    tone: BROWN,
    shape: "left-pointing triangle",
    elements: [{ tag: "path", attrs: { d: "M2 8 13.5 2v12z", fill: "tone" } }],
  },
  verified: {
    word: "Verified",
    explains: "A reviewer checked it against the document",
    tone: GREEN,
    shape: "filled square with a tick",
    elements: [
      { tag: "rect", attrs: { x: 1.5, y: 1.5, width: 13, height: 13, rx: 2.5, fill: "tone" } },
      check,
    ],
  },
  superseded: {
    word: "Superseded",
    explains: "Replaced by a newer verified document",
    tone: BLUE,
    shape: "two stacked squares",
    elements: [
      {
        tag: "rect",
        attrs: {
          x: 1.75,
          y: 1.75,
          width: 8.5,
          height: 8.5,
          fill: "none",
          stroke: "tone",
          "stroke-width": 1.5,
        },
      },
      {
        tag: "rect",
        attrs: {
          x: 5.75,
          y: 5.75,
          width: 8.5,
          height: 8.5,
          fill: "white",
          stroke: "tone",
          "stroke-width": 1.5,
        },
      },
    ],
  },
  lapsed: {
    word: "Lapsed",
    explains: "Its end date has passed; it no longer counts",
    tone: RED,
    shape: "cross",
    elements: [
      {
        tag: "path",
        attrs: { d: "m3.5 3.5 9 9m0-9-9 9", fill: "none", stroke: "tone", "stroke-width": 2.25 },
      },
    ],
  },
  requested: {
    word: "Requested",
    explains: "The shop asked; the service company has not answered yet",
    tone: BLUE,
    shape: "dashed square",
    elements: [
      {
        tag: "rect",
        attrs: {
          x: 2.5,
          y: 2.5,
          width: 11,
          height: 11,
          fill: "none",
          stroke: "tone",
          "stroke-width": 1.75,
          "stroke-dasharray": "2.5 2",
        },
      },
    ],
  },
  accepted: {
    word: "Accepted",
    explains: "The service company will do the work",
    tone: DEEP_BLUE,
    shape: "filled diamond",
    elements: [{ tag: "path", attrs: { d: "M8 1.75 14.25 8 8 14.25 1.75 8z", fill: "tone" } }],
  },
  declined: {
    word: "Declined",
    explains: "The service company will not do this work",
    tone: RED,
    shape: "ring with a slash",
    elements: [
      { tag: "circle", attrs: { cx: 8, cy: 8, r: 5.5, fill: "none", stroke: "tone", "stroke-width": 1.75 } },
      {
        tag: "path",
        attrs: { d: "m4.25 11.75 7.5-7.5", fill: "none", stroke: "tone", "stroke-width": 1.75 },
      },
    ],
  },
  completed: {
    word: "Completed",
    explains: "The technician marked the work done; the shop has not confirmed it yet",
    tone: GREEN,
    shape: "ring with a tick",
    elements: [
      { tag: "circle", attrs: { cx: 8, cy: 8, r: 5.75, fill: "none", stroke: "tone", "stroke-width": 1.5 } },
      { tag: "path", attrs: { d: "m5 8.25 2 2 4-4.25", fill: "none", stroke: "tone", "stroke-width": 1.75 } },
    ],
  },
  confirmed: {
    word: "Confirmed",
    explains: "The shop confirmed the work was done; it can now be rated",
    tone: GREEN,
    shape: "filled circle with a tick",
    elements: [{ tag: "circle", attrs: { cx: 8, cy: 8, r: 6.5, fill: "tone" } }, check],
  },
  withdrawn: {
    word: "Withdrawn",
    explains: "The sending shop called the transfer back before it was answered; nothing moved",
    tone: BLUE,
    shape: "open triangle",
    elements: [
      {
        tag: "path",
        attrs: { d: "M8 2.25 13.75 13.25H2.25z", fill: "none", stroke: "tone", "stroke-width": 1.5 },
      },
    ],
  },
  disputed: {
    word: "Disputed",
    explains: "The shop does not accept the completion yet; the two sides settle it in the messages",
    tone: BROWN,
    shape: "triangle with a bar",
    elements: [
      {
        tag: "path",
        attrs: { d: "M8 2 14.25 13.5H1.75z", fill: "none", stroke: "tone", "stroke-width": 1.5 },
      },
      { tag: "path", attrs: { d: "M8 6.25v4", fill: "none", stroke: "tone", "stroke-width": 1.75 } },
    ],
  },
  cancelled: {
    word: "Cancelled",
    explains: "The shop called the job off; nobody should travel for it",
    tone: RED,
    shape: "square with a cross",
    elements: [
      {
        tag: "rect",
        attrs: { x: 2.5, y: 2.5, width: 11, height: 11, fill: "none", stroke: "tone", "stroke-width": 1.5 },
      },
      {
        tag: "path",
        attrs: { d: "m5.25 5.25 5.5 5.5m0-5.5-5.5 5.5", fill: "none", stroke: "tone", "stroke-width": 1.5 },
      },
    ],
  },
};

/** An element's attributes with the mark's colour filled in. */
export const markAttrs = (mark: StatusMark, element: MarkElement): Record<string, string | number> =>
  Object.fromEntries(Object.entries(element.attrs).map(([k, v]) => [k, v === "tone" ? mark.tone : v]));

const escapeAttr = (v: string | number) => String(v).replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);

/** The mark as inline SVG markup, for pages rendered on the server (the printed proof). */
export function markSvg(meaning: StatusMeaning, size = 12): string {
  const mark = statusMarks[meaning];
  const inner = mark.elements
    .map((e) => {
      const attrs = Object.entries(markAttrs(mark, e))
        .map(([k, v]) => `${k}="${escapeAttr(v)}"`)
        .join(" ");
      return `<${e.tag} ${attrs}/>`;
    })
    .join("");
  return `<svg viewBox="0 0 16 16" width="${size}" height="${size}" aria-hidden="true" focusable="false">${inner}</svg>`;
}
