import { expect } from "vitest";
import type { DirectoryPageDto, DirectoryRowDto } from "../../../shared/directory/directory-shapes.ts";
import type { agentFor } from "../../support/test-app.ts";

type TestAgent = ReturnType<typeof agentFor>;

/** Follows nextCursor to the end and returns every row in order (and the pages, for page-size checks). */
export async function readAllPages(agent: TestAgent, query: Record<string, string>, maxPages = 200) {
  const rows: DirectoryRowDto[] = [];
  const pages: DirectoryPageDto[] = [];
  let cursor: string | null = null;
  do {
    const res = await agent.get("/api/directory").query(cursor ? { ...query, cursor } : query);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const page = res.body as DirectoryPageDto;
    pages.push(page);
    rows.push(...page.rows);
    cursor = page.nextCursor;
  } while (cursor && pages.length < maxPages);
  return { rows, pages };
}
