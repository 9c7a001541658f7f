export { lookupPostalCode, type PostalPlace } from "./postal-codes.ts";
