import { z } from "zod";

// The client needs no secrets; the API lives on the same origin, so its base is a path.
const envSchema = z.object({
  VITE_API_BASE: z.string().startsWith("/").default("/api"),
  MODE: z.string(),
});

export const env = Object.freeze(envSchema.parse(import.meta.env));
