package org.solmass.model;

import java.util.Arrays;

/** Growable int array without boxing, for import and patching. */
public final class IntList {
    private int[] a;
    private int size;

    public IntList() { this(64); }

    public IntList(int capacity) { a = new int[Math.max(4, capacity)]; }

    public void add(int x) {
        if (size == a.length) a = Arrays.copyOf(a, a.length * 2);
        a[size++] = x;
    }

    public int get(int i) { return a[i]; }

    public void set(int i, int x) { a[i] = x; }

    public int size() { return size; }

    public void truncate(int n) { size = n; }

    public int[] toArray() { return Arrays.copyOf(a, size); }
}
