package org.solmass.model;

import java.util.Arrays;

/** Growable double array without boxing. */
public final class DoubleList {
    private double[] a = new double[192];
    private int size;

    public void add(double x) {
        if (size == a.length) a = Arrays.copyOf(a, a.length * 2);
        a[size++] = x;
    }

    public double get(int i) { return a[i]; }

    public int size() { return size; }

    /** The backing array (valid up to {@link #size()}); no copy. */
    public double[] raw() { return a; }

    public double[] toArray() { return Arrays.copyOf(a, size); }
}
