import { describe, expect, it } from "vitest";
import { z } from "zod";
import { checkDeclaredAnswer } from "../../../server/http/response-check.ts";

const shape = z.object({ id: z.number(), createdAt: z.string() });

describe("the shape check on every JSON answer", () => {
  it("passes an answer that is exactly its schema, as the client reads it after JSON (dates as strings)", () => {
    expect(() =>
      checkDeclaredAnswer("GET /x", shape, { id: 1, createdAt: new Date("2027-03-15T12:00:00Z") }),
    ).not.toThrow();
  });

  it("refuses a field of the wrong type, naming the field", () => {
    expect(() => checkDeclaredAnswer("GET /x", shape, { id: "1", createdAt: "2027-03-15" })).toThrow(/at id/);
  });

  it("refuses a field the schema does not name, so nothing leaks past the declared shape", () => {
    expect(() =>
      checkDeclaredAnswer("GET /x", shape, { id: 1, createdAt: "2027-03-15", passwordHash: "x" }),
    ).toThrow(/does not name/);
  });

  it("refuses a JSON answer from a route that declares no schema", () => {
    expect(() => checkDeclaredAnswer("POST /x", undefined, { ok: true })).toThrow(
      /declares no response schema/,
    );
  });
});
