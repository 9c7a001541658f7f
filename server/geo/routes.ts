import { zipParams, zipPlaceDtoSchema } from "../../shared/geo/schemas.ts";
import { abuseLimit } from "../accounts/abuse-limits.ts";
import { placeOfCompany } from "../companies/address.ts";
import { createRoutes } from "../http/route.ts";
import { anyone } from "../http/policy.ts";

export const geoRoutes = createRoutes("/api");

// Public, for the sign-up form: the same ZIP -> zone rule the account is created with, so what it shows is what it gets.
geoRoutes.get(
  "/geo/zip/:zip",
  { allow: anyone, before: [abuseLimit("zipLookup")], params: zipParams, response: zipPlaceDtoSchema },
  (_req, _res, { params }) => {
    const place = placeOfCompany(params.zip, "params.zip");
    return { postalCode: place.postalCode, city: place.city, state: place.state, timeZone: place.timeZone };
  },
);
