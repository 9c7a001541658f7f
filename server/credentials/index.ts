export { credentialRoutes } from "./routes.ts";
export { Credential, CredentialType, Document, initCredentialModels } from "./model.ts";
export { loadCatalogue } from "./catalogue.ts";
export { safeFileName, sniffUpload } from "./upload-checks.ts";
export { imageDimensionsFromHeader } from "./extraction/image-dimensions.ts";
