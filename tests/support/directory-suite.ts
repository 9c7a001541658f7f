import { buildDirectoryWorld, type DirectoryWorld } from "../fixtures/build-directory-world.ts";
import { lateBound } from "./suite-hooks.ts";
import { signedInAs, type TestApp } from "./test-app.ts";
import { beforeAll } from "vitest";

type Agent = Awaited<ReturnType<typeof signedInAs>>;

/** A directory world built for the file in beforeAll, with its shop's buyer signed in. */
export function useDirectoryWorld(t: TestApp, options: Parameters<typeof buildDirectoryWorld>[0]) {
  let made: { world: DirectoryWorld; buyer: Agent } | undefined;
  beforeAll(async () => {
    const world = await buildDirectoryWorld(options);
    made = { world, buyer: await signedInAs(t.app, world.buyerEmail) };
  });
  return {
    world: lateBound(() => made?.world, "the directory world"),
    buyer: lateBound(() => made?.buyer, "the directory world's buyer"),
  };
}
