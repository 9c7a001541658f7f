import { describe, expect, it } from "vitest";
import {
  bayesianAverage,
  compareByRankingScore,
  wilsonLowerBound,
} from "../../../shared/ranking/rating-score.ts";

describe("rating score", () => {
  it("ranks forty 4.8-star jobs above one 5-star job (Bayesian average, m = 4.0, C = 10)", () => {
    const prior = { mean: 4.0, weight: 10 };

    const single = bayesianAverage({ count: 1, sumStars: 5 }, prior);
    const forty = bayesianAverage({ count: 40, sumStars: 192 }, prior);

    expect(single).toBeCloseTo(4.090909, 6); // Bayesian average (C·m + Σ) / (C + n), IMDb weighted-rating form (from memory): 45/11
    expect(forty).toBeCloseTo(4.64, 6); // Bayesian average, m = 4, C = 10: 232/50
    expect(forty).toBeGreaterThan(single);
  });

  it("gives the prior mean when there are no ratings", () => {
    const score = bayesianAverage({ count: 0, sumStars: 0 }, { mean: 4.0, weight: 10 });

    expect(score).toBe(4.0); // Bayesian average: no reviews gives the prior m
  });

  it("keeps the same order with m = 3.5, C = 5", () => {
    const prior = { mean: 3.5, weight: 5 };

    const single = bayesianAverage({ count: 1, sumStars: 5 }, prior);
    const forty = bayesianAverage({ count: 40, sumStars: 192 }, prior);

    expect(single).toBeCloseTo(3.75, 6); // Bayesian average, m = 3.5, C = 5: (17.5 + 5) / 6
    expect(forty).toBeCloseTo(4.655556, 6); // Bayesian average, m = 3.5, C = 5: (17.5 + 192) / 45
  });

  it("sorts the directory by the Bayesian score, highest first", () => {
    const technicians = [
      { name: "one five", ratings: { count: 1, sumStars: 5 } },
      { name: "forty", ratings: { count: 40, sumStars: 192 } },
      { name: "none", ratings: { count: 0, sumStars: 0 } },
    ];

    const order = [...technicians]
      .sort((a, b) => compareByRankingScore(a.ratings, b.ratings))
      .map((t) => t.name);

    expect(order).toEqual(["forty", "one five", "none"]); // Bayesian average (IMDb weighted-rating form, from memory), m = 4.0, C = 10
  });

  it.each([
    { positive: 2, total: 2, lower: 0.342372 },
    { positive: 100, total: 101, lower: 0.946032 },
    { positive: 1, total: 1, lower: 0.206543 },
    { positive: 9, total: 10, lower: 0.595844 },
    { positive: 40, total: 40, lower: 0.912375 },
    { positive: 0, total: 0, lower: 0 },
  ])(
    "gives a Wilson lower bound of $lower for $positive/$total at z = 1.96",
    ({ positive, total, lower }) => {
      const bound = wilsonLowerBound(positive, total);

      expect(bound).toBeCloseTo(lower, 6); // Wilson score lower bound (E. B. Wilson 1927; Evan Miller, "How Not To Sort By Average Rating", 2009 from memory)
    },
  );

  it.each([
    { positive: 2, total: 2, lower: 0.425031 },
    { positive: 100, total: 101, lower: 0.956838 },
    { positive: 1, total: 1, lower: 0.269866 },
    { positive: 9, total: 10, lower: 0.652281 },
    { positive: 40, total: 40, lower: 0.936647 },
  ])(
    "gives Miller's one-sided bound of $lower for $positive/$total at z = 1.644854",
    ({ positive, total, lower }) => {
      // The 95th percentile of the standard normal to full precision; Evan Miller's sample uses 1.644854.
      const bound = wilsonLowerBound(positive, total, 1.6448536269514722);

      expect(bound).toBeCloseTo(lower, 6); // Evan Miller, "How Not To Sort By Average Rating" (one-sided 95 %; year 2009 from memory)
    },
  );
});
