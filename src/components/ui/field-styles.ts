/** The look every text-like control shares; the border colour is added by whoever knows whether it is in error. */
export const fieldInputStyles =
  "block w-full rounded-md border bg-white px-3 py-2 text-base text-ink-900 shadow-sm " +
  "placeholder:text-ink-500 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink-700";
