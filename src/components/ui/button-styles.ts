export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger";

const base =
  "inline-flex min-h-10 items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold " +
  "transition-colors focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-ink-700 " +
  "disabled:cursor-not-allowed disabled:opacity-60";

// One warm accent, kept for the primary action; ink text on it keeps contrast above 4.5:1.
const variants: Record<ButtonVariant, string> = {
  primary: "bg-accent-500 text-ink-900 hover:bg-accent-400 shadow-sm",
  secondary: "border border-ink-300 bg-white text-ink-900 hover:bg-ink-50",
  quiet: "text-ink-700 underline-offset-4 hover:underline hover:bg-ink-50",
  danger: "border border-red-700 bg-white text-red-800 hover:bg-red-50",
};

/** Class names for a button, shared by `<Button>` and links styled as buttons. */
export const buttonStyles = (variant: ButtonVariant = "primary", extra = ""): string =>
  `${base} ${variants[variant]} ${extra}`.trim();
