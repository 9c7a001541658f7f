import { DEFAULT_PRIOR } from "../../shared/ranking/rating-score.ts";

/** The prior that migration 202612021110 built technician_ratings.ranking_score with (m = 4 stars, C = 10). */
export const STORED_SCORE_PRIOR = { mean: 4, weight: 10 } as const;

/**
 * True while the stored column still equals rankingScore with DEFAULT_PRIOR. If the prior changes, the search computes
 * the score in the query again (correct, only slower) until a new migration regenerates the column.
 */
export const storedScoreIsCurrent =
  DEFAULT_PRIOR.mean === STORED_SCORE_PRIOR.mean && DEFAULT_PRIOR.weight === STORED_SCORE_PRIOR.weight;
