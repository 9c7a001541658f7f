import type { SelectOption } from "@/components/ui/select-field.tsx";

// IANA zones that cover the United States and its territories (IANA tz database, zone1970.tab).
export const usTimeZoneOptions: readonly SelectOption[] = [
  { value: "America/New_York", label: "Eastern (New York)" },
  { value: "America/Detroit", label: "Eastern (Detroit)" },
  { value: "America/Indiana/Indianapolis", label: "Eastern (Indianapolis)" },
  { value: "America/Kentucky/Louisville", label: "Eastern (Louisville)" },
  { value: "America/Chicago", label: "Central (Chicago)" },
  { value: "America/Indiana/Knox", label: "Central (Knox, Indiana)" },
  { value: "America/Menominee", label: "Central (Menominee)" },
  { value: "America/North_Dakota/Center", label: "Central (Center, North Dakota)" },
  { value: "America/Denver", label: "Mountain (Denver)" },
  { value: "America/Boise", label: "Mountain (Boise)" },
  { value: "America/Phoenix", label: "Mountain, no daylight saving (Phoenix)" },
  { value: "America/Los_Angeles", label: "Pacific (Los Angeles)" },
  { value: "America/Anchorage", label: "Alaska (Anchorage)" },
  { value: "America/Adak", label: "Hawaii-Aleutian (Adak)" },
  { value: "Pacific/Honolulu", label: "Hawaii (Honolulu)" },
  { value: "America/Puerto_Rico", label: "Atlantic (Puerto Rico)" },
  { value: "Pacific/Guam", label: "Chamorro (Guam)" },
];

/** The browser's zone when it is one of ours, so most people need not touch the select. */
export function likelyTimeZone(): string {
  const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  return usTimeZoneOptions.some((o) => o.value === zone) ? zone : "";
}
