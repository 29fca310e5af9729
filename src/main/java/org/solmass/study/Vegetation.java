package org.solmass.study;

import org.solmass.model.MassingModel;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.regex.Pattern;

/**
 * Trees of a study (key {@code vegetation}): which triangles are tree crowns and how much light one
 * crossing of a crown lets through, month by month. Tree triangles are taken out of the opaque model:
 * they get no patches, do not reflect and attenuate the rays that cross them (docs/method.md,
 * "Vegetation").
 *
 * <p>Default transmittances (fraction of the beam that passes one crown crossing), northern
 * hemisphere months; for a site south of the equator {@link #monthly(double)} shifts the deciduous
 * year by six months. Values are common practice, from memory, in the ranges measured by Heisler
 * (1986), "Effects of individual trees on the solar radiation climate of small buildings", Urban
 * Ecology 9, 337-359 (crowns in leaf pass about 0.1-0.3 of the beam, leafless crowns about 0.4-0.8)
 * and Canton, Cortegoso and de Rosa (1994), "Solar permeability of urban trees in cities of western
 * Argentina", Energy and Buildings 20, 219-230:
 * <ul>
 * <li>deciduous: 0.6 December to March (bare), 0.45 in April and October (leaf-out, leaf fall),
 * 0.25 May to September (in leaf);</li>
 * <li>evergreen: 0.15 all year.</li>
 * </ul>
 *
 * @param blockPatterns block names that are trees; {@code *} matches any run of characters, {@code ?}
 *                      one character; matched against the whole name, case-sensitive
 * @param materialPatterns OBJ {@code usemtl} names whose faces are trees (same wildcards)
 * @param kind the default transmittance year when {@code transmittance} is null
 * @param transmittance 12 values, January first, each in [0, 1], or null for the kind's defaults
 */
public record Vegetation(List<String> blockPatterns, List<String> materialPatterns, Kind kind, double[] transmittance) {

    /** Leaf habit: which default transmittance year applies. */
    public enum Kind {
        DECIDUOUS(new double[]{0.6, 0.6, 0.6, 0.45, 0.25, 0.25, 0.25, 0.25, 0.25, 0.45, 0.6, 0.6}),
        EVERGREEN(new double[]{0.15, 0.15, 0.15, 0.15, 0.15, 0.15, 0.15, 0.15, 0.15, 0.15, 0.15, 0.15});

        private final double[] northern;

        Kind(double[] northern) { this.northern = northern; }

        /** The default transmittance per month (January first) for the northern hemisphere. */
        public double[] northernDefaults() { return northern.clone(); }

        public String label() { return name().toLowerCase(java.util.Locale.ROOT); }
    }

    public Vegetation {
        blockPatterns = List.copyOf(blockPatterns);
        materialPatterns = List.copyOf(materialPatterns);
        kind = kind == null ? Kind.DECIDUOUS : kind;
        if (transmittance != null) {
            if (transmittance.length != 12) throw new IllegalArgumentException("12 monthly transmittances expected");
            for (double t : transmittance) {
                if (!(t >= 0 && t <= 1)) throw new IllegalArgumentException("transmittance outside [0, 1]: " + t);
            }
            transmittance = transmittance.clone();
        }
    }

    /** Whether the study marks anything as trees. */
    public boolean any() { return !blockPatterns.isEmpty() || !materialPatterns.isEmpty(); }

    /**
     * Transmittance of one crown crossing per month (index 0 = January) at a site of this latitude:
     * the study's values as given, or the kind's defaults, shifted by six months south of the equator.
     */
    public double[] monthly(double latitudeDeg) {
        if (transmittance != null) return transmittance.clone();
        double[] n = kind.northernDefaults();
        if (latitudeDeg >= 0) return n;
        double[] s = new double[12];
        for (int m = 0; m < 12; m++) s[m] = n[(m + 6) % 12];
        return s;
    }

    /** Per triangle: whether it is a tree face (its block's name or its material matches a pattern). */
    public boolean[] treeTriangles(MassingModel model) {
        boolean[] blockIsTree = matches(blockPatterns, model.blockNames());
        boolean[] materialIsTree = matches(materialPatterns, model.materialNames());
        boolean[] out = new boolean[model.triangleCount()];
        for (int t = 0; t < out.length; t++) {
            int m = model.triangleMaterial()[t];
            out[t] = blockIsTree[model.triangleBlock()[t]] || (m >= 0 && materialIsTree[m]);
        }
        return out;
    }

    /** Warnings for patterns that match no block (or no material) of the model. */
    public List<String> unmatched(MassingModel model) {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < blockPatterns.size(); i++) {
            if (!anyMatch(blockPatterns.get(i), model.blockNames())) {
                out.add("vegetation.blocks[" + i + "]: the pattern \"" + blockPatterns.get(i)
                        + "\" matches no block of the model (it has: " + String.join(", ", model.blockNames()) + ")");
            }
        }
        for (int i = 0; i < materialPatterns.size(); i++) {
            if (!anyMatch(materialPatterns.get(i), model.materialNames())) {
                out.add("vegetation.materials[" + i + "]: the pattern \"" + materialPatterns.get(i)
                        + "\" matches no material (usemtl) of the model");
            }
        }
        return out;
    }

    private static boolean anyMatch(String pattern, List<String> names) {
        Pattern p = glob(pattern);
        for (String n : names) if (p.matcher(n).matches()) return true;
        return false;
    }

    private static boolean[] matches(List<String> patterns, List<String> names) {
        boolean[] out = new boolean[names.size()];
        for (String pattern : patterns) {
            Pattern p = glob(pattern);
            for (int i = 0; i < out.length; i++) out[i] |= p.matcher(names.get(i)).matches();
        }
        return out;
    }

    /** A name pattern with {@code *} (any run) and {@code ?} (one character); everything else literal. */
    static Pattern glob(String pattern) {
        StringBuilder re = new StringBuilder();
        StringBuilder lit = new StringBuilder();
        for (char ch : pattern.toCharArray()) {
            if (ch == '*' || ch == '?') {
                if (lit.length() > 0) re.append(Pattern.quote(lit.toString()));
                lit.setLength(0);
                re.append(ch == '*' ? ".*" : ".");
            } else {
                lit.append(ch);
            }
        }
        if (lit.length() > 0) re.append(Pattern.quote(lit.toString()));
        return Pattern.compile(re.toString(), Pattern.DOTALL);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Vegetation v && blockPatterns.equals(v.blockPatterns) && materialPatterns.equals(v.materialPatterns)
                && kind == v.kind && Arrays.equals(transmittance, v.transmittance);
    }

    @Override
    public int hashCode() {
        return (blockPatterns.hashCode() * 31 + materialPatterns.hashCode()) * 31 + kind.hashCode() * 7 + Arrays.hashCode(transmittance);
    }

    /** No trees. */
    public static final Vegetation NONE = new Vegetation(List.of(), List.of(), Kind.DECIDUOUS, null);
}
