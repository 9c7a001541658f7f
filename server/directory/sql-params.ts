/** Collects positional parameters ($1, $2, ...) while SQL text is assembled, so no value is ever spliced into it. */
export class SqlParams {
  readonly values: unknown[] = [];

  add(value: unknown): string {
    this.values.push(value);
    return `$${this.values.length}`;
  }
}

/** ILIKE pattern matching the text anywhere; the user's %, _ and \ match themselves. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
