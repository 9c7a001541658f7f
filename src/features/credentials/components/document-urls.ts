import { env } from "@/config/env.ts";

/** File routes check role and ownership on every request; they are never static paths. */
export const documentUrls = {
  download: (documentId: number) => `${env.VITE_API_BASE}/documents/${documentId}/file`,
  inlineImage: (documentId: number) => `${env.VITE_API_BASE}/documents/${documentId}/file?inline=1`,
  page: (documentId: number, page: number) => `${env.VITE_API_BASE}/documents/${documentId}/pages/${page}`,
};
