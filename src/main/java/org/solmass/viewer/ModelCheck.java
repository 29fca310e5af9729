package org.solmass.viewer;

import org.solmass.check.Plausibility;
import org.solmass.check.Warning;
import org.solmass.irradiation.MemoryEstimate;
import org.solmass.model.LengthUnit;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.model.TriangleGeometry;
import org.solmass.model.UpAxis;
import org.solmass.scene.HemisphereSampler;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A model as the set-up reads it (with the chosen up axis and unit): its blocks, the face area of
 * each (undersides left out, as the patcher leaves them out), the reader's warnings and the
 * plausibility checks as suggestions the user can take with one click, before any run.
 *
 * @param model       the model as read
 * @param unit        the unit it was read in
 * @param notes       the reader's warnings (e.g. zero-area faces dropped)
 * @param suggestions plausibility findings, in the window's words, with the change that answers them
 * @param blockAreaM2 face area per block id, m2, undersides left out
 */
record ModelCheck(MassingModel model, LengthUnit unit, List<String> notes, List<Suggestion> suggestions, double[] blockAreaM2) {

    /**
     * One plausibility finding.
     *
     * @param text what looks wrong and why, in the window's words
     * @param unit the unit to switch to, or null
     * @param up   the up axis to switch to, or null
     */
    record Suggestion(String text, LengthUnit unit, UpAxis up) {}

    /** The patch size of context blocks relative to the analysed one (the pipeline's, cli.AnalysisRun). */
    static final double CONTEXT_PATCH_FACTOR = 4;

    /**
     * Patches x hemisphere rays one worker thread gets through per second over a whole run (patching,
     * rays, sun, metrics), measured: the sample's courtyard model (the tower as context) at 2 m
     * patches, 1,024 rays, clear sky, 6,599 patches in 36 s on the 2-core build machine under a load
     * of about 10 (94,000 per thread and second). A rough figure: the estimate gives half to twice it.
     */
    static final double RAYS_PER_SECOND_PER_THREAD = 1.0e5;

    static ModelCheck read(Path obj, UpAxis up, LengthUnit unit) {
        ObjReader.Result r = ObjReader.load(obj, new ModelOptions(up, unit, 0));
        MassingModel m = r.model();
        List<Suggestion> s = new ArrayList<>();
        for (Warning w : Plausibility.model(m)) s.add(suggestion(w, m, up, unit));
        double[] area = new double[m.blockNames().size()];
        double[] cr = new double[3];
        for (int t = 0; t < m.triangleCount(); t++) {
            TriangleGeometry.cross(m.vertices(), m.triangles(), t, cr);
            double len = TriangleGeometry.length(cr);
            if (cr[2] < -0.9 * len) continue;   // undersides are not patched
            area[m.triangleBlock()[t]] += 0.5 * len;
        }
        return new ModelCheck(m, unit, r.warnings(), s, area);
    }

    /**
     * Opens a model for a new study: in metres, z up; when metres make it too large to read (wider
     * than {@link org.solmass.model.CoordinateRange#MAX_EXTENT_M}, as a millimetre model of a district
     * is), in millimetres, then centimetres, with a suggestion that says so first.
     *
     * @throws org.solmass.InputException the metres reader's error when no unit reads it
     */
    static ModelCheck open(Path obj) {
        try {
            return read(obj, UpAxis.Z, LengthUnit.M);
        } catch (org.solmass.InputException inMetres) {
            String m = String.valueOf(inMetres.getMessage());
            if (!m.contains("supported extent") && !m.contains("supported range")) throw inMetres;
            for (LengthUnit u : new LengthUnit[] {LengthUnit.MM, LengthUnit.CM}) {
                try {
                    ModelCheck c = read(obj, UpAxis.Z, u);
                    List<Suggestion> s = new ArrayList<>();
                    s.add(new Suggestion(String.format(Locale.ROOT, "Read in metres, the model is wider than %,.0f km, more than"
                            + " Solmass reads and more than any district: it was probably drawn in %s, and it is read so now."
                            + " Check the unit above.", org.solmass.model.CoordinateRange.MAX_EXTENT_M / 1000, unitName(u)), null, null));
                    s.addAll(c.suggestions());
                    return new ModelCheck(c.model(), u, c.notes(), s, c.blockAreaM2());
                } catch (org.solmass.InputException ignored) {
                    // try the next unit
                }
            }
            throw inMetres;
        }
    }

    private static Suggestion suggestion(Warning w, MassingModel m, UpAxis up, LengthUnit unit) {
        double[] b = m.bounds();
        double h = b[5] - b[2], across = Math.max(b[3] - b[0], b[4] - b[1]);
        if (w.code().equals("model-not-in-metres")) {
            // the size in metres as drawn, whatever unit it was read in, decides the suggestion
            double f = 1 / unit.toMetres();
            List<LengthUnit> ok = Plausibility.plausibleUnits(h * f, across * f);
            LengthUnit pick = ok.isEmpty() ? null : ok.get(0);
            String as = pick == null ? "" : String.format(Locale.ROOT, " In %s it would be %.1f m tall and %.0f m across.",
                    unitName(pick), h * f * pick.toMetres(), across * f * pick.toMetres());
            return new Suggestion(String.format(Locale.ROOT, "Read in %s, the model is %,.0f m tall and %,.0f m across: no building"
                    + " or district is that large. It was probably drawn in millimetres or centimetres.%s", unitName(unit), h, across, as), pick, null);
        }
        if (w.code().equals("model-y-up")) {
            return new Suggestion("The blocks seem to lie on their side, as a model drawn with y up looks when read with z up."
                    + " Try y as the up axis.", null, UpAxis.Y);
        }
        return new Suggestion(GuiWords.of(w.text()), null, null);
    }

    static String unitName(LengthUnit u) {
        return switch (u) {
            case M -> "metres";
            case CM -> "centimetres";
            case MM -> "millimetres";
            case FT -> "feet";
        };
    }

    /** Face area of the analysed blocks (true) or the context blocks (false), m2. */
    double areaM2(boolean[] analysed, boolean which) {
        double a = 0;
        for (int i = 0; i < blockAreaM2.length; i++) if (analysed[i] == which) a += blockAreaM2[i];
        return a;
    }

    /**
     * Memory and time before a run.
     *
     * @param patches   analysed patches, about (area / patch size squared)
     * @param bytes     heap the analysis will allocate ({@link MemoryEstimate#beforePatching})
     * @param freeBytes heap free now
     * @param fits      whether it fits with the estimate's headroom
     * @param fitPatchM the smallest patch size that would fit, NaN when none does
     * @param seconds   rough run time, seconds
     */
    record Estimate(long patches, long bytes, long freeBytes, boolean fits, double fitPatchM, double seconds) {
        String text() {
            String mem = String.format(Locale.ROOT, "About %,d patches. Memory: about %s of %s free.", patches, size(bytes), size(freeBytes));
            String time = seconds < 60 ? String.format(Locale.ROOT, " Time: roughly %.0f to %.0f s.", Math.max(1, seconds / 2), Math.max(2, 2 * seconds))
                    : String.format(Locale.ROOT, " Time: roughly %.0f to %.0f min.", Math.max(1, seconds / 120), Math.max(2, seconds / 30));
            return mem + time;
        }

        String advice() {
            if (fits) return "";
            return Double.isNaN(fitPatchM) || fitPatchM > 100 ? "This does not fit in memory at any patch size; give Java more memory."
                    : String.format(Locale.ROOT, "This does not fit in memory. A patch size of %.2f m or more would fit.", fitPatchM);
        }
    }

    Estimate estimate(boolean[] analysed, double patchM, int rays, boolean keepMonthHour) {
        int threads = Runtime.getRuntime().availableProcessors();
        int raysRounded = HemisphereSampler.roundedRayCount(rays);
        double inA = areaM2(analysed, true), ctxA = areaM2(analysed, false);
        MemoryEstimate m = MemoryEstimate.beforePatching(inA, patchM, ctxA, patchM * CONTEXT_PATCH_FACTOR, raysRounded,
                org.solmass.irradiation.IrradiationSetup.reflectorRays(raysRounded, org.solmass.irradiation.IrradiationSetup.REFLECTOR_RAYS),
                keepMonthHour, threads); // the set-up panel's studies keep the default reflection rays
        long free = MemoryEstimate.freeHeapBytes();
        long patches = (long) Math.ceil(inA / (patchM * patchM));
        long ctx = (long) Math.ceil(ctxA / (patchM * CONTEXT_PATCH_FACTOR * patchM * CONTEXT_PATCH_FACTOR));
        double seconds = (double) (patches + ctx) * raysRounded / (RAYS_PER_SECOND_PER_THREAD * threads);
        return new Estimate(patches, m.bytes(), free, m.fits(free), m.fittingPatchM(patchM, free), seconds);
    }

    static String size(long b) {
        return b >= 1L << 30 ? String.format(Locale.ROOT, "%.1f GB", b / (double) (1L << 30))
                : b >= 1L << 20 ? String.format(Locale.ROOT, "%.0f MB", b / (double) (1L << 20))
                : String.format(Locale.ROOT, "%.0f KB", Math.max(1, b / 1024.0));
    }
}
