/** Ratings of one technician: the count of jobs rated and the sum of their stars (1 to 5). */
export interface RatingSummary {
  count: number;
  sumStars: number;
}

export interface BayesianPrior {
  /** Prior mean m, in stars: the platform's mean rating. */
  mean: number;
  /** Prior weight C, in pseudo-reviews: how many ratings it takes before a technician's own average dominates. */
  weight: number;
}

/** Used when the platform has too few ratings to have a mean of its own (common practice: a neutral-to-good prior). */
export const DEFAULT_PRIOR: BayesianPrior = { mean: 4.0, weight: 10 };

/**
 * Bayesian average (C·m + Σ ratings) / (C + n): the same form as the IMDb weighted rating (from memory). With no
 * ratings it is the prior mean; one 5-star job (4.09) stays below forty 4.8-star jobs (4.64) with m = 4, C = 10.
 * This is the score the directory sorts by: it stays on the 1-5 star scale people read, and uses every star rather than
 * a positive/negative split.
 */
export function bayesianAverage(ratings: RatingSummary, prior: BayesianPrior = DEFAULT_PRIOR): number {
  return (prior.weight * prior.mean + ratings.sumStars) / (prior.weight + ratings.count);
}

/** z for a two-sided 95 % interval (the usual two-sided choice, z = 1.96). */
export const WILSON_Z_95 = 1.96;

/**
 * Lower bound of the Wilson score interval for a proportion of positive ratings (E. B. Wilson 1927; Evan Miller,
 * "How Not To Sort By Average Rating", 2009). Kept as the alternative score; 0 when there are no ratings (convention).
 */
export function wilsonLowerBound(positive: number, total: number, z: number = WILSON_Z_95): number {
  if (total === 0) return 0;
  const pHat = positive / total;
  const z2 = z * z;
  const centre = pHat + z2 / (2 * total);
  const margin = z * Math.sqrt((pHat * (1 - pHat)) / total + z2 / (4 * total * total));
  return (centre - margin) / (1 + z2 / total);
}

/** Common practice for 5-star input to Wilson: 4 and 5 stars count as positive. */
export function isPositiveRating(stars: number): boolean {
  return stars >= 4;
}

/** The directory's sort score. */
export function rankingScore(ratings: RatingSummary, prior: BayesianPrior = DEFAULT_PRIOR): number {
  return bayesianAverage(ratings, prior);
}

/** For Array.prototype.sort: highest score first. */
export function compareByRankingScore(
  a: RatingSummary,
  b: RatingSummary,
  prior: BayesianPrior = DEFAULT_PRIOR,
): number {
  return rankingScore(b, prior) - rankingScore(a, prior);
}
