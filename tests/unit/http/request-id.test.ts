import { describe, expect, it } from "vitest";
import { requestIdOf } from "../../../server/http/request-log.ts";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe("the request id named in log lines", () => {
  it("keeps a proxy's id that looks like one", () => {
    expect(requestIdOf("9f1c2a7e-5b0d-4c3e-8a21-0d6f4b7e9c11")).toBe("9f1c2a7e-5b0d-4c3e-8a21-0d6f4b7e9c11");
    expect(requestIdOf("edge.7f3a:12")).toBe("edge.7f3a:12");
  });

  it("makes a fresh one (an RFC 9562 version 4 UUID) when the header is missing, repeated, too long or not an id", () => {
    for (const header of [undefined, ["a", "b"], "x".repeat(129), "id with spaces", 'quote"break', ""]) {
      expect(requestIdOf(header)).toMatch(UUID);
    }
  });
});
