/**
 * The one place where distances change unit. Distances are stored and computed in kilometres (fields ending in `Km`);
 * every distance a person reads (screens, e-mails, the printed proof) is shown in miles, as US shops and price lists
 * ($/mile, mph) speak of them.
 */

/** International statute mile, exactly 1,609.344 m (international yard and pound agreement, 1959). */
export const KM_PER_STATUTE_MILE = 1.609344;

export function kmToMiles(km: number): number {
  return km / KM_PER_STATUTE_MILE;
}

export function milesToKm(miles: number): number {
  return miles * KM_PER_STATUTE_MILE;
}

/** "7.4 miles", "1 mile", "120 miles": one decimal under ten miles, whole miles above. */
export function formatMiles(km: number): string {
  const miles = kmToMiles(km);
  const shown = miles < 10 ? miles.toFixed(1).replace(/\.0$/, "") : String(Math.round(miles));
  return `${shown} ${shown === "1" ? "mile" : "miles"}`;
}

/** A stored whole-kilometre radius as the whole number of miles a person typed. */
export const wholeMilesFromKm = (km: number): number => Math.round(kmToMiles(km));

/** Whole miles typed by a person as the whole kilometres stored; whole miles survive the round trip. */
export const wholeKmFromMiles = (miles: number): number => Math.round(milesToKm(miles));
