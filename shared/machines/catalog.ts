import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";

export const catalogKinds = ["builder", "control_family"] as const;
export type CatalogKind = (typeof catalogKinds)[number];

export const catalogEntryDtoSchema = z.object({
  id: z.number(),
  kind: z.enum(catalogKinds),
  name: z.string(),
  aliases: z.array(z.string()),
  active: z.boolean(),
});
export type CatalogEntryDto = z.infer<typeof catalogEntryDtoSchema>;

/** The key two spellings of one name share: case and runs of white space do not count. */
export function catalogKey(text: string): string {
  return text.normalize("NFKC").trim().replace(/\s+/g, " ").toLowerCase();
}

/** The entry a typed name means: its own name or one of its aliases, compared by key. */
export function findCatalogEntry<E extends Pick<CatalogEntryDto, "name" | "aliases">>(
  entries: readonly E[],
  typed: string,
): E | null {
  const key = catalogKey(typed);
  if (key === "") return null;
  return (
    entries.find((e) => catalogKey(e.name) === key) ??
    entries.find((e) => e.aliases.some((a) => catalogKey(a) === key)) ??
    null
  );
}

/** Every key a record written under this name may carry (the name and its aliases); just the typed key when unknown. */
export function matchKeysFor(
  entries: readonly Pick<CatalogEntryDto, "name" | "aliases">[],
  typed: string,
): string[] {
  const entry = findCatalogEntry(entries, typed);
  if (!entry) return [catalogKey(typed)];
  return [...new Set([entry.name, ...entry.aliases].map(catalogKey))];
}

const catalogName = () => singleLineText().trim().min(1, "Enter a name").max(120);

export const catalogEntryInputSchema = z
  .object({
    kind: z.enum(catalogKinds),
    name: catalogName(),
    aliases: z.array(catalogName()).max(20, "At most 20 aliases").default([]),
    active: z.boolean().default(true),
  })
  .superRefine((v, ctx) => {
    const keys = [v.name, ...v.aliases].map(catalogKey);
    keys.forEach((k, i) => {
      if (i > 0 && keys.indexOf(k) !== i)
        ctx.addIssue({
          code: "custom",
          path: ["aliases", i - 1],
          message: "repeats the name or another alias",
        });
    });
  });
export type CatalogEntryInput = z.infer<typeof catalogEntryInputSchema>;

export const catalogListQuerySchema = z.object({ kind: z.enum(catalogKinds).optional() });
export const catalogEntryParamsSchema = z.object({ entryId: idParam });
