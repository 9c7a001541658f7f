/** The text values of a form's named fields, for a zod parse. Files are not read here. */
export function readForm(form: HTMLFormElement): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [name, value] of new FormData(form)) {
    if (typeof value === "string") values[name] = value;
  }
  return values;
}
