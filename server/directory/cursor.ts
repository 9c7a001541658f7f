import { z } from "zod";
import { directorySorts, type DirectorySort } from "../../shared/directory/schemas.ts";
import { AppError } from "../http/app-error.ts";

/** Keyset position: the last row's sort value and id. Opaque to clients (base64url JSON). */
export interface DirectoryCursor {
  sort: DirectorySort;
  key: number;
  id: number;
}

const cursorSchema = z.object({
  s: z.enum(directorySorts),
  k: z.number().finite(),
  i: z.number().int().positive(),
});

export function encodeCursor(cursor: DirectoryCursor): string {
  return Buffer.from(JSON.stringify({ s: cursor.sort, k: cursor.key, i: cursor.id })).toString("base64url");
}

export function decodeCursor(text: string, sort: DirectorySort): DirectoryCursor {
  const bad = () =>
    new AppError("bad_request", "The page cursor is not valid", [
      { path: "query.cursor", message: "start again from the first page" },
    ]);
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(text, "base64url").toString("utf8"));
  } catch {
    throw bad();
  }
  const result = cursorSchema.safeParse(parsed);
  // A cursor from another sort order would skip or repeat rows.
  if (!result.success || result.data.s !== sort) throw bad();
  return { sort: result.data.s, key: result.data.k, id: result.data.i };
}
