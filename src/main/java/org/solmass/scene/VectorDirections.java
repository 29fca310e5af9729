package org.solmass.scene;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.LongVector;
import jdk.incubator.vector.VectorMask;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

/**
 * The hemisphere directions of {@link HemisphereSampler#directions} several rays at a time (8 lanes
 * of double with AVX-512, 4 with AVX2), with the incubating Vector API of the JDK (JEP 414): the two
 * SplitMix64 draws, the concentric map with the fdlibm sine and cosine kernels, Malley's lift and the
 * tangent frame of {@link HemisphereSampler#cosineDirection}, operation for operation (IEEE double,
 * no fused multiply-add, selects for the wedge choice), so every lane gives the scalar direction bit
 * for bit (tested). The tangent frame is computed once per patch instead of once per ray.
 *
 * <p>Ray s (row i, column j of the k x k grid) takes draws number 2s+1 and 2s+2 of the patch's
 * SplitMix64 stream, whose states are {@code seed + (2s+1) gamma} and {@code seed + (2s+2) gamma}
 * (the generator's state only ever adds gamma; Steele, Lea and Flood, 2014), so the lanes need no
 * sequential state: the per-ray offsets, rows and columns are tables made once per grid size.
 *
 * <p>Loaded only when the module {@code jdk.incubator.vector} is present ({@link BundleTracer#SIMD_AVAILABLE}).
 * Vector values never outlive one method, as in {@link VectorOcclusion}.
 */
final class VectorDirections {
    private static final VectorSpecies<Double> D = DoubleVector.SPECIES_PREFERRED;
    private static final VectorSpecies<Long> L = LongVector.SPECIES_PREFERRED;
    private static final int LANES = D.length();

    private final int count, padded;
    private final double inv;
    /** Per ray (padded to whole vectors): SplitMix64 state offsets of its two draws, its row and column. */
    private final long[] offset1, offset2;
    private final double[] row, column;
    /** Per ray: the stages' results (square point, radius, angle, its sine and cosine, world direction). */
    private final double[] ua, ub, radius, phi, sinPhi, cosPhi, wx, wy, wz;

    VectorDirections(int side) {
        if (L.length() != LANES) throw new IllegalStateException("long and double vectors of unequal lane counts");
        this.count = side * side;
        this.padded = (count + LANES - 1) / LANES * LANES;
        this.inv = 1.0 / side;
        offset1 = new long[padded];
        offset2 = new long[padded];
        row = new double[padded];
        column = new double[padded];
        for (int s = 0; s < padded; s++) {
            offset1[s] = (2L * s + 1) * HemisphereSampler.GOLDEN;
            offset2[s] = (2L * s + 2) * HemisphereSampler.GOLDEN;
            row[s] = s < count ? s / side : 0;
            column[s] = s < count ? s % side : 0;
        }
        ua = new double[padded];
        ub = new double[padded];
        radius = new double[padded];
        phi = new double[padded];
        sinPhi = new double[padded];
        cosPhi = new double[padded];
        wx = new double[padded];
        wy = new double[padded];
        wz = new double[padded];
    }

    /** As {@link HemisphereSampler#directions}: fills {@code dir[3s..3s+2]} for s &lt; side^2. */
    void directions(double nx, double ny, double nz, long seed, double[] dir) {
        double sign = Math.copySign(1.0, nz); // the tangent frame of cosineDirection, once
        double a = -1.0 / (sign + nz), b = nx * ny * a;
        double t1x = 1 + sign * nx * nx * a, t1y = sign * b, t1z = -sign * nx;
        double t2x = b, t2y = sign + ny * ny * a, t2z = -ny;
        // stage by stage through small arrays: a method too large for C2's inlining budget would
        // run the Vector API's allocating Java fallback instead of the intrinsics
        for (int q = 0; q < padded; q += LANES) square(q, seed);
        for (int q = 0; q < padded; q += LANES) angle(q);
        for (int q = 0; q < padded; q += LANES) sin(q);
        for (int q = 0; q < padded; q += LANES) cos(q);
        for (int q = 0; q < padded; q += LANES) lift(q, nx, ny, nz, t1x, t1y, t1z, t2x, t2y, t2z);
        final double[] x = wx, y = wy, z = wz;
        for (int s = 0; s < count; s++) {
            dir[3 * s] = x[s];
            dir[3 * s + 1] = y[s];
            dir[3 * s + 2] = z[s];
        }
    }

    /** Rays q..q+LANES-1: the jittered point of the square, as (2u - 1, 2v - 1) into ua, ub. */
    private void square(int q, long seed) {
        DoubleVector r1 = uniform(LongVector.fromArray(L, offset1, q).add(seed));
        DoubleVector r2 = uniform(LongVector.fromArray(L, offset2, q).add(seed));
        DoubleVector.fromArray(D, row, q).add(r1).mul(inv).mul(2.0).sub(1.0).intoArray(ua, q);
        DoubleVector.fromArray(D, column, q).add(r2).mul(inv).mul(2.0).sub(1.0).intoArray(ub, q);
    }

    /** Radius and wedge angle phi of the concentric map into radius, phi (0 at the centre). */
    private void angle(int q) {
        DoubleVector a = DoubleVector.fromArray(D, ua, q), b = DoubleVector.fromArray(D, ub, q);
        VectorMask<Double> aMajor = a.abs().compare(VectorOperators.GT, b.abs());
        DoubleVector r = b.blend(a, aMajor);
        r.intoArray(radius, q);
        a.blend(b, aMajor).div(r).mul(Math.PI / 4).blend(0.0, r.compare(VectorOperators.EQ, 0.0)).intoArray(phi, q);
    }

    /** Lifted to the hemisphere and turned into the world frame, into wx, wy, wz. */
    private void lift(int q, double nx, double ny, double nz,
                      double t1x, double t1y, double t1z, double t2x, double t2y, double t2z) {
        DoubleVector a = DoubleVector.fromArray(D, ua, q), b = DoubleVector.fromArray(D, ub, q);
        VectorMask<Double> aMajor = a.abs().compare(VectorOperators.GT, b.abs());
        DoubleVector r = DoubleVector.fromArray(D, radius, q);
        DoubleVector c = DoubleVector.fromArray(D, cosPhi, q), sn = DoubleVector.fromArray(D, sinPhi, q);
        DoubleVector x = r.mul(sn.blend(c, aMajor)), y = r.mul(c.blend(sn, aMajor));
        DoubleVector z = DoubleVector.broadcast(D, 1.0).sub(x.mul(x)).sub(y.mul(y)).max(0.0).sqrt();
        x.mul(t1x).add(y.mul(t2x)).add(z.mul(nx)).intoArray(wx, q);
        x.mul(t1y).add(y.mul(t2y)).add(z.mul(ny)).intoArray(wy, q);
        x.mul(t1z).add(y.mul(t2z)).add(z.mul(nz)).intoArray(wz, q);
    }

    /** SplitMix64 output of the states, as a double in [0, 1) from its upper 53 bits (exact). */
    private static DoubleVector uniform(LongVector state) {
        LongVector z = state.lanewise(VectorOperators.XOR, state.lanewise(VectorOperators.LSHR, 30)).mul(0xbf58476d1ce4e5b9L);
        z = z.lanewise(VectorOperators.XOR, z.lanewise(VectorOperators.LSHR, 27)).mul(0x94d049bb133111ebL);
        z = z.lanewise(VectorOperators.XOR, z.lanewise(VectorOperators.LSHR, 31));
        // (z >>> 11) 2^-53 without a long-to-double conversion (no AVX2 instruction for it: the API's
        // slow Java fallback ran instead): the upper 52 bits as the mantissa of a double in [1, 2),
        // minus 1 (exact, Sterbenz), plus the 53rd bit's 2^-53; the sum is a multiple of 2^-53 below 1,
        // so it is exact and equals the scalar (mix >>> 11) * 0x1.0p-53 bit for bit
        DoubleVector high = z.lanewise(VectorOperators.LSHR, 12).or(ONE_BITS).reinterpretAsDoubles().sub(1.0);
        VectorMask<Double> lowBit = z.lanewise(VectorOperators.LSHR, 11).and(1L).compare(VectorOperators.NE, 0L).cast(D);
        return high.add(DoubleVector.zero(D).blend(0x1.0p-53, lowBit));
    }

    /** The bits of 1.0: sign 0, exponent 1023, mantissa 0. */
    private static final long ONE_BITS = Double.doubleToRawLongBits(1.0);

    /** {@link HemisphereSampler#sinKernel} lane-wise, phi into sinPhi. */
    private void sin(int q) {
        DoubleVector x = DoubleVector.fromArray(D, phi, q);
        DoubleVector z = x.mul(x), v = z.mul(x);
        DoubleVector r = z.mul(HemisphereSampler.S6).add(HemisphereSampler.S5).mul(z).add(HemisphereSampler.S4)
                .mul(z).add(HemisphereSampler.S3).mul(z).add(HemisphereSampler.S2);
        x.add(v.mul(z.mul(r).add(HemisphereSampler.S1)))
                .blend(x, x.abs().compare(VectorOperators.LT, HemisphereSampler.TINY_ANGLE)).intoArray(sinPhi, q);
    }

    /** {@link HemisphereSampler#cosKernel} lane-wise (its three cases by selects), phi into cosPhi. */
    private void cos(int q) {
        DoubleVector x = DoubleVector.fromArray(D, phi, q);
        DoubleVector ax = x.abs(), z = x.mul(x);
        DoubleVector r = z.mul(HemisphereSampler.C6).add(HemisphereSampler.C5).mul(z).add(HemisphereSampler.C4)
                .mul(z).add(HemisphereSampler.C3).mul(z).add(HemisphereSampler.C2).mul(z).add(HemisphereSampler.C1).mul(z);
        DoubleVector zr = z.mul(r), hz0 = z.mul(0.5);
        DoubleVector one = DoubleVector.broadcast(D, 1);
        DoubleVector small = one.sub(hz0.sub(zr));
        DoubleVector qx = ax.reinterpretAsLongs().and(0xFFFFFFFF00000000L).sub(0x0020000000000000L).reinterpretAsDoubles()
                .blend(0.28125, ax.compare(VectorOperators.GE, HemisphereSampler.COS_QX_FIXED));
        DoubleVector large = one.sub(qx).sub(hz0.sub(qx).sub(zr));
        large.blend(small, ax.compare(VectorOperators.LT, HemisphereSampler.COS_SPLIT))
                .blend(1.0, ax.compare(VectorOperators.LT, HemisphereSampler.TINY_ANGLE)).intoArray(cosPhi, q);
    }
}
