/** A zod `.pick()` mask from a list of field names, so a response shape can follow a rule's own field list. */
export const fieldMask = <K extends string>(keys: readonly K[]) =>
  Object.fromEntries(keys.map((k) => [k, true])) as Record<K, true>;
