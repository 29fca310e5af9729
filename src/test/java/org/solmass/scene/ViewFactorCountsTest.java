package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * {@link SkyViewCalculator#fromClasses} against the estimators written out here from their textbook
 * form: each view factor is the share of its rays; the standard error of the sky share, with the
 * k x k strata collapsed in pairs along each row (a triple at the end of an odd row), is the
 * collapsed-strata estimator of Cochran, Sampling Techniques, 3rd ed., 1977, section 5A.12: per group
 * of g strata with one ray each, {@code g / (g - 1) * sum (y - mean)^2} over its rays (y = 1 for sky),
 * summed over the groups; its square root over n rays. Checked on
 * random class grids for even and odd k, bit for bit (the counts are exact in either form).
 */
class ViewFactorCountsTest {
    @Test
    void countsAndStandardErrorFollowTheCollapsedStrataEstimator() {
        SplittableRandom r = new SplittableRandom(3);
        for (int k : new int[] {1, 2, 3, 4, 5, 7, 16, 32, 33}) {
            for (int trial = 0; trial < 20; trial++) {
                int n = k * k;
                int[] cls = new int[n];
                double pSky = r.nextDouble(), pGround = r.nextDouble() * (1 - pSky);
                for (int s = 0; s < n; s++) {
                    double u = r.nextDouble();
                    cls[s] = u < pSky ? HemisphereSampler.SKY : u < pSky + pGround ? HemisphereSampler.GROUND : HemisphereSampler.BLOCK;
                }
                int sky = 0, ground = 0;
                for (int c : cls) {
                    if (c == HemisphereSampler.SKY) sky++;
                    else if (c == HemisphereSampler.GROUND) ground++;
                }
                double varSum = 0;
                for (int row = 0; row < k && k > 1; row++) {
                    for (int c = 0; c < k; ) {
                        int g = k - c == 3 ? 3 : 2;
                        double mean = 0, ss = 0;
                        for (int q = 0; q < g; q++) mean += cls[row * k + c + q] == HemisphereSampler.SKY ? 1 : 0;
                        mean /= g;
                        for (int q = 0; q < g; q++) {
                            double y = cls[row * k + c + q] == HemisphereSampler.SKY ? 1 : 0;
                            ss += (y - mean) * (y - mean);
                        }
                        varSum += ss * g / (g - 1);
                        c += g;
                    }
                }
                ViewFactors vf = SkyViewCalculator.fromClasses(cls, k);
                String at = "k " + k + " trial " + trial;
                assertEquals((double) sky / n, vf.sky(), 0.0, at);
                assertEquals((double) ground / n, vf.ground(), 0.0, at);
                assertEquals((double) (n - sky - ground) / n, vf.obstruction(), 0.0, at);
                // one ray gives no variance estimate: the calculator reports 0.5, the largest standard error a share can have
                assertEquals(k == 1 ? 0.5 : Math.sqrt(varSum) / n, vf.skyStdError(), 0.0, at);
            }
        }
    }
}
