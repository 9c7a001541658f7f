import { afterAll, beforeAll } from "vitest";

/**
 * A stand-in for a value that exists only once a hook has run: every property read goes to `get()`, so
 * a test file can hold it in a module constant (`const t = useTestApp()`) instead of a `let` that its
 * own beforeAll assigns. A method called through it gets the stand-in as `this`, whose reads and
 * writes reach the real value, so plain objects and supertest agents behave as themselves.
 */
export function lateBound<T extends object>(get: () => T | undefined, what: string): T {
  const current = () => {
    const value = get();
    if (value === undefined) throw new Error(`${what} is read before the beforeAll that makes it has run`);
    return value;
  };
  return new Proxy({} as T, {
    get: (_target, key) => Reflect.get(current(), key),
    set: (_target, key, property) => Reflect.set(current(), key, property),
    has: (_target, key) => Reflect.has(current(), key),
  });
}

/** A value made before the file's tests and ended after them (hooks run in the order they are declared). */
export function useForFile<T extends object>(
  what: string,
  start: () => T | Promise<T>,
  stop?: (value: T) => unknown,
): T {
  let value: T | undefined;
  beforeAll(async () => {
    value = await start();
  });
  afterAll(async () => {
    if (value !== undefined && stop) await stop(value);
  });
  return lateBound(() => value, what);
}
