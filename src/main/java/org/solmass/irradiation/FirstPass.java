package org.solmass.irradiation;

/**
 * The first pass (beam + sky diffuse) of every receiver per month-hour slot, kept only for the slots
 * that can hold light: a slot without any sun-up step, sky diffuse or GHI of the weather series is
 * zero for every receiver (night hours, about half of the 288), so it is left out of the array and
 * of the reflection sums. Reading a left-out slot gives 0, which is what it holds; every sum over
 * the kept slots in slot order equals the sum over all slots, bit for bit (adding +0 changes nothing).
 * A receiver's row is padded with zeros to a multiple of {@link #PAD} slots, so that the SIMD kernel
 * of the reflection ({@link SlotBounceSimd}) reads whole vectors (166 kept slots of an hourly year: 168).
 */
final class FirstPass {
    static final int SLOTS = StepTable.SLOTS;
    /** Rows are padded to a multiple of this many slots (8 doubles: one 512-bit vector). */
    static final int PAD = 8;
    /** Kept slots, ascending. */
    final int[] live;
    /** Month 0..11 of each kept slot. */
    final int[] liveMonth;
    /** Position of a slot among the kept ones, -1 when left out. */
    final int[] position;
    /** Row length: the kept slots rounded up to a multiple of {@link #PAD}. */
    private final int stride;
    /** Receiver r's kept slot i at {@code r * stride() + i}, Wh/m2; the padding holds 0. */
    final double[] values;
    /** Per receiver: the sum of its slots in slot order, Wh/m2. */
    final double[] annual;

    FirstPass(int receivers, StepTable st) {
        this(receivers, litSlots(st));
    }

    /** Rows for the slots marked in {@code lit} (288 entries). */
    FirstPass(int receivers, boolean[] lit) {
        int n = 0;
        for (boolean b : lit) if (b) n++;
        live = new int[n];
        liveMonth = new int[n];
        position = new int[SLOTS];
        for (int k = 0, i = 0; k < SLOTS; k++) {
            position[k] = lit[k] ? i : -1;
            if (lit[k]) {
                live[i] = k;
                liveMonth[i++] = org.solmass.climate.MonthHour.month(k) - 1;
            }
        }
        stride = rowLength(n);
        values = new double[Math.multiplyExact(receivers, stride)];
        annual = new double[receivers];
    }

    /**
     * Slots that can hold first-pass light or GHI: a sun-up step (beam, circumsolar), or any sky
     * background, horizon band, sky-patch radiance, DHI or GHI summed into the slot.
     */
    static boolean[] litSlots(StepTable st) {
        boolean[] lit = new boolean[SLOTS];
        for (int s = 0; s < st.count; s++) lit[st.slot[s]] = true;
        for (int k = 0; k < SLOTS; k++) {
            lit[k] |= st.ghiWh[k] != 0 || st.dhiWh[k] != 0 || st.backgroundWh[k] != 0 || st.horizonWh[k] != 0;
        }
        if (st.skyWh != null) for (int i = 0; i < st.skyWh.length; i++) if (st.skyWh[i] != 0) lit[i % SLOTS] = true;
        return lit;
    }

    /** Number of slots kept for a step table. */
    static int liveSlots(StepTable st) {
        int n = 0;
        for (boolean b : litSlots(st)) if (b) n++;
        return n;
    }

    /** Number of kept slots. */
    int slots() {
        return live.length;
    }

    /** Length of a receiver's row in {@link #values}: the kept slots and the padding. */
    int stride() {
        return stride;
    }

    /** Row length for {@code kept} slots: rounded up to a multiple of {@link #PAD}. */
    static int rowLength(int kept) {
        return (kept + PAD - 1) / PAD * PAD;
    }

    /** Stores receiver r's 288 slot sums; a left-out slot must hold 0. */
    void put(int r, double[] slotSums) {
        int base = r * stride;
        double s = 0;
        for (int k = 0; k < SLOTS; k++) {
            double v = slotSums[k];
            int i = position[k];
            if (i >= 0) values[base + i] = v;
            else if (v != 0) throw new IllegalStateException("first pass light in slot " + k + " without sun, sky or GHI");
            s += v;
        }
        annual[r] = s;
    }

    /** Receiver r's first pass in slot k (0..287), Wh/m2. */
    double slot(int r, int k) {
        int i = position[k];
        return i < 0 ? 0 : values[r * stride + i];
    }
}
