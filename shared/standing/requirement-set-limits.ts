/**
 * Active requirement sets one shop may keep. Every active set stores a standing row for every technician and is
 * recomputed by each daily run, so the count is what sign-up abuse would multiply; 50 is far above what a shop with a
 * handful of sites and machine families needs (common practice: one set per site or per kind of job).
 */
export const MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP = 50;
