package org.solmass.climate;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a climate source repaired or noticed while reading its input: one line per kind of repair
 * with its count and the first place it happened, plus free warnings.
 */
public record ClimateReport(List<String> repairs, List<String> warnings) {
    public ClimateReport {
        repairs = List.copyOf(repairs);
        warnings = List.copyOf(warnings);
    }

    public boolean isClean() { return repairs.isEmpty() && warnings.isEmpty(); }

    /** Collects repairs while a source reads. */
    static final class Builder {
        private final Map<String, int[]> counts = new LinkedHashMap<>();
        private final Map<String, String> first = new LinkedHashMap<>();
        private final List<String> warnings = new ArrayList<>();

        void repair(String kind, String where) {
            counts.computeIfAbsent(kind, k -> new int[1])[0]++;
            first.putIfAbsent(kind, where);
        }

        void warn(String message) { warnings.add(message); }

        int count(String kind) { int[] c = counts.get(kind); return c == null ? 0 : c[0]; }

        ClimateReport build() {
            List<String> r = new ArrayList<>();
            counts.forEach((k, c) -> r.add(k + ": " + c[0] + (c[0] == 1 ? " step" : " steps") + " (first at " + first.get(k) + ")"));
            return new ClimateReport(r, warnings);
        }
    }
}
