package org.solmass.irradiation;

import org.solmass.InputException;

import java.util.Locale;

/**
 * Heap the visibility and irradiation phase will still allocate, estimated from the counts before it
 * starts, so a study too large for the JVM is refused with a patch size that fits instead of failing
 * deep inside with OutOfMemoryError. The byte counts follow the arrays of {@link ShadedIrradiation}
 * (4-byte floats and ints, 8-byte doubles and longs, 16-byte array headers):
 * <ul>
 * <li>per receiver (analysed patch, context patch or ground probe): the first-pass month-hour slot
 *     sums of the slots that can hold light ({@link FirstPass}: at most 288, about half of them in an
 *     hourly year, padded to a multiple of 8; 8 bytes a slot: they are the sums later weighted into other patches'
 *     reflection, so they stay doubles) with their annual sum, the current and the next reflection
 *     bounce as month sums, {@code 2 x double[12]} ({@link Reflection}: the same whatever the number
 *     of bounces; the first holds the first pass's month sums during bounce 1), its
 *     annual total and last-bounce sum, origin, normal, seed, surface and
 *     reflector index share (about 80 B: 16 B of local coordinates, and per bucket of about one receiver a record of 16 ints and about 20 B of cell lists, {@link ReflectorIndex}), and its reflector list with its GHI weight; a reflector-only receiver's
 *     list holds up to one reference (int + float) per reflector ray;</li>
 * <li>per analysed patch: up to one reflector reference (int + float + the float of squared albedo for
 *     the standard error) per hemisphere ray, about 40 per-patch result doubles (components, standard
 *     error, 3 x 12 months, the reflected months) and the result table's columns, and the month-hour
 *     table {@code float[288]} with bounce 1's month sums {@code double[12]} when it is kept;</li>
 * <li>per worker thread: the ray scratch arrays and the slot sums of one block of receivers in
 *     reflection's bounce 1 ({@link SlotBounce}); per sun-up step: the step table ({@link StepTable}:
 *     sun vector, direction, slot, beam, circumsolar, cos zenith and sunshine entries).</li>
 * </ul>
 * The receiver count grows as 1 / patch size squared, which gives the suggested patch size.
 *
 * @param bytes          estimated bytes still to allocate
 * @param countBytes     the part that scales with the number of receivers and patches
 */
public record MemoryEstimate(long bytes, long countBytes) {
    /** Per receiver besides the first pass's slot sums (8 bytes for each slot kept). */
    static final long PER_RECEIVER_BESIDES_SLOTS = 16 + 8 + 2 * 12 * 8 + 8 + 8 + 48 + 8 + 4 + 24 + 2 * 16 + 4 + 16
            + 4 * (4 + 16) + 4;
    static final long PER_RECEIVER = StepTable.SLOTS * 8L + PER_RECEIVER_BESIDES_SLOTS;
    static final long PER_REFLECTOR_ONLY_PER_RAY = 4 + 4;
    static final long PER_PATCH_FIXED = 40 * 8 + 36 * 8 + 2 * 16 + 30 * 8 + 12 * 8 + 8 + 16 + 4;
    static final long PER_PATCH_PER_RAY = 4 + 4 + 4;
    static final long PER_THREAD_PER_RAY = 24 + 4 + 4 + 8 + 4 + 4 + 8;
    static final long PER_STEP = 3 * 4 + 4 + 4 + 8 + 8 + 4 + 8;
    /** Share of the free heap the estimate may use: the rest is for what the estimate leaves out. */
    public static final double HEADROOM = 0.8;

    /**
     * @param receivers      all receivers: analysed patches, context patches, ground probes
     * @param analysed       analysed patches
     * @param raysPerPatch   hemisphere rays per analysed patch (after rounding)
     * @param steps          weather steps
     * @param keepMonthHour  whether the per-patch month-hour table is kept
     * @param threads        worker threads
     */
    public static MemoryEstimate of(long receivers, long analysed, int raysPerPatch, int steps,
                                    boolean keepMonthHour, int threads) {
        return of(receivers, analysed, raysPerPatch, steps, keepMonthHour, threads, StepTable.SLOTS);
    }

    /**
     * The estimate with the number of first-pass slots kept ({@link FirstPass}: the slots that can
     * hold light; all 288 when not yet known).
     */
    static MemoryEstimate of(long receivers, long analysed, int raysPerPatch, int steps,
                             boolean keepMonthHour, int threads, int keptSlots) {
        return of(receivers, analysed, raysPerPatch, IrradiationSetup.reflectorRays(raysPerPatch), steps, keepMonthHour, threads, keptSlots);
    }

    /** As above with the run's reflection rays ({@link IrradiationSetup#reflectorRays(int, int)}). */
    static MemoryEstimate of(long receivers, long analysed, int raysPerPatch, int reflectorRays, int steps,
                             boolean keepMonthHour, int threads, int keptSlots) {
        int firstPassSlots = FirstPass.rowLength(keptSlots);
        long counts = receivers * (firstPassSlots * 8L + PER_RECEIVER_BESIDES_SLOTS)
                + (receivers - analysed) * PER_REFLECTOR_ONLY_PER_RAY * reflectorRays
                + analysed * (PER_PATCH_FIXED + PER_PATCH_PER_RAY * org.solmass.scene.HemisphereSampler.reflectionRayCount(raysPerPatch, reflectorRays)
                + (keepMonthHour ? StepTable.SLOTS * 4L + 12 * 8 : 0));
        long fixed = (long) threads * (raysPerPatch * PER_THREAD_PER_RAY + 16 + SlotBounce.BLOCK * firstPassSlots * 8L)
                + (long) steps * PER_STEP;
        return new MemoryEstimate(counts + fixed, counts);
    }

    /** Heap of one patch object with its id and outline before any result exists, bytes (common practice: a measured order of magnitude). */
    static final long PATCH_OBJECT_BYTES = 400;

    /**
     * The estimate before patching, from surface areas: a grid of patches of side {@code patchM}
     * covers an area A with about A / patchM^2 patches (more where surfaces end mid-cell), and each
     * patch object comes on top of the arrays above. Lets a run stop before the patcher fills the heap.
     *
     * @param analysedAreaM2 area of the analysed blocks' faces, m2
     * @param contextAreaM2  area of the context blocks' faces, m2, patched at {@code contextPatchM}
     * @param reflectorRays  the run's reflection rays ({@link IrradiationSetup#reflectorRays(int, int)})
     */
    public static MemoryEstimate beforePatching(double analysedAreaM2, double patchM, double contextAreaM2, double contextPatchM,
                                                int raysPerPatch, int reflectorRays, boolean keepMonthHour, int threads) {
        long analysed = (long) Math.ceil(analysedAreaM2 / (patchM * patchM));
        long context = (long) Math.ceil(contextAreaM2 / (contextPatchM * contextPatchM));
        MemoryEstimate m = of(analysed + context, analysed, raysPerPatch, reflectorRays, 0, keepMonthHour, threads, StepTable.SLOTS);
        long objects = (analysed + context) * PATCH_OBJECT_BYTES;
        return new MemoryEstimate(m.bytes() + objects, m.countBytes() + objects);
    }

    /**
     * Heap per receiver of a city run's prepared study besides its patch object ({@code
     * tiles.CityModel}: the receiver layout's origin, normal, seed, surface and centre, and the whole
     * layout's reflector index, built at the first tile). Measured with the JVM's count of the heap in
     * use after a full collection, an invented synthetic city of 335,283 receivers (3 December 2026,
     * twice the same): 273 B per receiver in all (patch objects included) once prepared, 400 B once a
     * tile's first pass has built the whole reflector index. {@link #PATCH_OBJECT_BYTES} + this =
     * 600 B per receiver, 1.5 times the measured, for what the collections leave out (the index's
     * build, garbage between collections).
     */
    static final long TILES_PER_RECEIVER_BYTES = 200;

    /** {@link #forTilesBeforePatching}'s bytes for a known number of receivers. */
    public static long forTilesBytes(long receivers) {
        return receivers * (PATCH_OBJECT_BYTES + TILES_PER_RECEIVER_BYTES);
    }

    /**
     * The estimate before patching for a city run's JVM ({@code tiles.CityModel}: the driver and each
     * executor prepare the whole study, then work tile by tile): the patch objects and the layout of
     * every receiver with the whole reflector index (ground probes are few: not counted), not the
     * one-machine run's arrays of {@link #of}, which a tile's passes build for the tile's own
     * receivers only (bounded by the tile size, docs/city.md "What a task holds"). Without it the
     * city runner refused a 10^6-patch city on executors of 6 GB with the one-machine run's 7.9 GB,
     * where the prepared study holds about 0.4 GB.
     */
    public static MemoryEstimate forTilesBeforePatching(double analysedAreaM2, double patchM, double contextAreaM2, double contextPatchM) {
        long analysed = (long) Math.ceil(analysedAreaM2 / (patchM * patchM));
        long context = (long) Math.ceil(contextAreaM2 / (contextPatchM * contextPatchM));
        long b = forTilesBytes(analysed + context);
        return new MemoryEstimate(b, b);
    }

    /** The estimate for inputs already built. */
    public static MemoryEstimate of(ShadedIrradiation.Inputs in, int threads) {
        return of(in.receivers().count, in.receivers().analysed, in.raysPerPatch(), in.reflectorRays(), in.steps().count,
                in.keepMonthHour(), threads, FirstPass.liveSlots(in.steps()));
    }

    /**
     * Smallest patch size (metres, rounded up to 0.05 m below 1 m and 0.25 m above) at which the
     * estimate fits {@code budgetBytes}, from a run at {@code patchM}; NaN when even a huge patch does not fit.
     */
    public double fittingPatchM(double patchM, long budgetBytes) {
        double usable = HEADROOM * budgetBytes - (bytes - countBytes);
        if (usable <= 0) return Double.NaN;
        double p = patchM * Math.sqrt(countBytes / usable);
        double stepM = p < 1 ? 0.05 : 0.25;
        return Math.ceil(p / stepM - 1e-9) * stepM;
    }

    /** Whether the estimate fits {@code budgetBytes} with the headroom. */
    public boolean fits(long budgetBytes) {
        return bytes <= HEADROOM * budgetBytes;
    }

    /**
     * Throws when the estimate does not fit {@code budgetBytes}.
     *
     * @param where the key or flag of the patch size ("patch_m", "--patch")
     */
    public void requireFits(long budgetBytes, double patchM, int rays, long analysedPatches, String where) {
        requireFits(budgetBytes, patchM, rays, analysedPatches, where, "the analysis", "SOLMASS_JAVA_OPTS=-Xmx..., the launcher's default is -Xmx8g");
    }

    /**
     * As {@link #requireFits(long, double, int, long, String)} for the study a city run prepares
     * ({@link #forTilesBeforePatching}, which does not depend on the rays); {@code settings} names
     * where that JVM's memory is set.
     */
    public void requireFitsForTiles(long budgetBytes, double patchM, long patches, String where, String settings) {
        requireFits(budgetBytes, patchM, -1, patches, where, "preparing the model for its tiles", settings);
    }

    /** {@code rays < 0}: an estimate that does not depend on them (neither named nor advised). */
    private void requireFits(long budgetBytes, double patchM, int rays, long patches, String where, String what, String settings) {
        if (fits(budgetBytes)) return;
        double fit = fittingPatchM(patchM, budgetBytes);
        String advice = Double.isNaN(fit) || fit > 100
                ? "no patch size fits; give Java more memory"
                : String.format(Locale.ROOT, "use a patch size of at least %.2f m (it would fit), %sor give Java more memory", fit,
                rays < 0 ? "" : "fewer rays, ");
        throw new InputException(where, String.format(Locale.ROOT,
                "%s needs about %s of memory for %d patches at %.2f m%s, but only %s of the Java heap is free; %s (%s)",
                what, size(bytes), patches, patchM, rays < 0 ? "" : " with " + rays + " rays", size(budgetBytes), advice, settings));
    }

    /** Free heap now: the JVM's maximum minus what is in use. */
    public static long freeHeapBytes() {
        Runtime rt = Runtime.getRuntime();
        return rt.maxMemory() - (rt.totalMemory() - rt.freeMemory());
    }

    static String size(long b) {
        return b >= 1L << 30 ? String.format(Locale.ROOT, "%.1f GB", b / (double) (1L << 30))
                : String.format(Locale.ROOT, "%.0f MB", b / (double) (1L << 20));
    }
}
