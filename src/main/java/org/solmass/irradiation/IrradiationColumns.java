package org.solmass.irradiation;

import org.solmass.scene.ViewFactors;
import org.solmass.surface.Patch;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;
import org.solmass.table.ResultTable;
import org.solmass.table.Unit;

import java.time.Month;
import java.time.format.TextStyle;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * The result columns of the view-factor and irradiation stages: their definitions (the only place
 * their names, units, labels and decimals are written) and how they are filled from an
 * {@link IrradiationResult}. Meanings: docs/outputs.md, generated from these definitions.
 */
public final class IrradiationColumns {
    public static final Column SKY_VIEW_FACTOR = Column.of("sky_view_factor", Unit.RATIO, "Sky view factor",
            "Share of the patch's view that reaches the sky (cosine-weighted), 0 to 1.");
    public static final Column GROUND_VIEW_FACTOR = Column.of("ground_view_factor", Unit.RATIO, "Ground view factor",
            "Share that reaches the ground plane.");
    public static final Column OBSTRUCTION_VIEW_FACTOR = Column.of("obstruction_view_factor", Unit.RATIO,
            "Obstruction view factor", "Share that reaches blocks of the model (sky-view only).");
    public static final Column SVF_STD_ERROR = Column.of("svf_std_error", Unit.RATIO, "Sky view factor standard error",
            "Standard error of the sky view factor from the ray sampling.");
    public static final Column ANNUAL_STD_ERROR = Column.of("annual_std_error_kwh_m2", Unit.KWH_M2,
            "Annual irradiation standard error",
            "Standard error of annual_kwh_m2 from the ray sampling (sky hemisphere and reflection rays; sun and horizon"
                    + " band rays are a fixed grid). An upper bound: it treats the stratified rays as independent"
                    + " (docs/method.md).");
    public static final Column ANNUAL = Column.of("annual_kwh_m2", Unit.KWH_M2, "Annual irradiation",
            "Annual irradiation on the patch, all components, with obstruction.");
    public static final Column BEAM = Column.of("beam_kwh_m2", Unit.KWH_M2, "Annual beam (direct) irradiation",
            "Of which beam (direct).");
    public static final Column DIFFUSE = Column.of("diffuse_kwh_m2", Unit.KWH_M2, "Annual sky diffuse irradiation",
            "Of which sky diffuse.");
    public static final Column REFLECTED = Column.of("reflected_kwh_m2", Unit.KWH_M2, "Annual reflected irradiation",
            "Of which reflected by the ground and the surrounding blocks.");
    public static final Column UNSHADED = Column.of("unshaded_kwh_m2", Unit.KWH_M2, "Annual irradiation without obstruction",
            "Annual irradiation of the same plane with nothing around it.");
    public static final Column SHADING_LOSS = Column.of("shading_loss_pct", Unit.PERCENT, "Shading loss",
            "Loss by the surroundings: 100 x (1 - annual / unshaded).");
    public static final Column ANNUAL_KWH = Column.of("annual_kwh", Unit.KWH, "Annual irradiation on the whole patch",
            "Annual irradiation times patch area.");
    public static final Column SUNSHINE_H = Column.of("sunshine_h", Unit.HOURS, "Sunshine hours seen",
            "Hours per year with DNI of at least 120 W/m2 (the WMO definition of sunshine duration) while the patch"
                    + " sees the sun in front of it. Only with an hourly year: the mean hours of monthly-average days say"
                    + " nothing about how often the sun actually shines, so the column is left out there.");
    public static final Column SUNSHINE_SHARE = Column.of("sunshine_share_pct", Unit.PERCENT, "Share of the site's sunshine hours",
            "`sunshine_h` as a share of the site's (unobstructed) sunshine hours over the same period (hourly year only).");

    /** {@code m01_kwh_m2} ... {@code m12_kwh_m2}. */
    public static final ColumnFamily MONTHLY = new ColumnFamily("m01_kwh_m2 ... m12_kwh_m2",
            Pattern.compile("m(0[1-9]|1[0-2])_kwh_m2"), m -> month(Integer.parseInt(m.group(1))), month(1));

    /** Every column this stage declares, in the order of docs/outputs.md. */
    public static final List<ColumnFamily> COLUMNS = families();

    private IrradiationColumns() {}

    private static List<ColumnFamily> families() {
        List<ColumnFamily> out = new ArrayList<>(ColumnFamily.of(SKY_VIEW_FACTOR, GROUND_VIEW_FACTOR, SVF_STD_ERROR,
                ANNUAL_STD_ERROR, ANNUAL, BEAM, DIFFUSE, REFLECTED, UNSHADED, SHADING_LOSS, ANNUAL_KWH));
        out.add(MONTHLY);
        out.addAll(ColumnFamily.of(SUNSHINE_H, SUNSHINE_SHARE, OBSTRUCTION_VIEW_FACTOR));
        return List.copyOf(out);
    }

    /** Irradiation of month 1..12. */
    public static Column month(int month) {
        String name = Month.of(month).getDisplayName(TextStyle.FULL, Locale.ENGLISH);
        return Column.of(String.format(Locale.ROOT, "m%02d_kwh_m2", month), Unit.KWH_M2, name + " irradiation",
                "Monthly irradiation, January to December.");
    }

    /**
     * Adds the irradiation stage's columns in the documented order: view factors, annual sums by
     * component, shading loss, per-patch total, months, and the sunshine hours of an hourly year.
     */
    public static void addTo(ResultTable tb, IrradiationResult r, boolean hourlyYear) {
        int n = r.size();
        List<Patch> patches = tb.patches();
        tb.put(SKY_VIEW_FACTOR, r.skyViewFactor());
        tb.put(GROUND_VIEW_FACTOR, r.groundViewFactor());
        tb.put(SVF_STD_ERROR, r.skyViewStdError());
        tb.put(ANNUAL_STD_ERROR, r.annualStdError());
        tb.put(ANNUAL, r.annual());
        tb.put(BEAM, r.beam());
        tb.put(DIFFUSE, r.diffuse());
        tb.put(REFLECTED, r.reflected());
        tb.put(UNSHADED, r.unshaded());
        double[] loss = new double[n], kwh = new double[n];
        for (int p = 0; p < n; p++) {
            loss[p] = r.shadingLossPct(p);
            kwh[p] = r.annual()[p] * patches.get(p).areaM2();
        }
        tb.put(SHADING_LOSS, loss);
        tb.put(ANNUAL_KWH, kwh);
        for (int m = 0; m < 12; m++) tb.put(month(m + 1), r.monthly()[m]);
        if (hourlyYear) { // sunshine duration needs real hours: an average day's mean DNI says nothing about it
            double[] share = new double[n];
            for (int p = 0; p < n; p++) share[p] = r.siteSunshineHours() > 0 ? 100 * r.sunshineHours()[p] / r.siteSunshineHours() : 0;
            tb.put(SUNSHINE_H, r.sunshineHours());
            tb.put(SUNSHINE_SHARE, share);
        }
    }

    /** The columns of a sky-view pass: sky, ground and obstruction view factors and the standard error. */
    public static void addViewFactors(ResultTable tb, ViewFactors[] vf) {
        int n = vf.length;
        double[] sky = new double[n], gr = new double[n], ob = new double[n], se = new double[n];
        for (int i = 0; i < n; i++) {
            sky[i] = vf[i].sky();
            gr[i] = vf[i].ground();
            ob[i] = vf[i].obstruction();
            se[i] = vf[i].skyStdError();
        }
        tb.put(SKY_VIEW_FACTOR, sky).put(GROUND_VIEW_FACTOR, gr).put(OBSTRUCTION_VIEW_FACTOR, ob).put(SVF_STD_ERROR, se);
    }
}
