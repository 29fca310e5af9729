package org.solmass.sky;

import org.solmass.InputException;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The one registry of sky diffuse models, by the name a study file, a flag or the viewer uses. A new
 * sky model is one entry here; the study reader, the {@code --sky} help and the viewer's choice list
 * all read this list. The first entry is the default. The Perez et al. (1990) three-part model and
 * the isotropic sky come first; the radiance distributions ({@link SkyDistribution}: Perez et al.
 * 1993, the CIE traditional overcast sky, the 15 CIE standard general skies) follow.
 */
public final class SkyModels {
    private static final Map<String, SkyModel> BY_NAME = new LinkedHashMap<>();

    static {
        register(Perez.INSTANCE);
        register(Isotropic.INSTANCE);
        register(PerezAllWeather.INSTANCE);
        register(CieSky.OVERCAST);
        for (CieSky c : CieSky.GENERAL) register(c);
    }

    private SkyModels() {}

    private static void register(SkyModel m) {
        if (BY_NAME.put(m.name(), m) != null) throw new IllegalStateException("two sky models named " + m.name());
    }

    /** The default sky model (Perez et al. 1990). */
    public static SkyModel standard() { return BY_NAME.values().iterator().next(); }

    /** The known names, the default first. */
    public static List<String> names() { return List.copyOf(BY_NAME.keySet()); }

    /** The known names as one text, "perez, isotropic, perez-1993, ...". */
    public static String namesText() { return String.join(", ", names()); }

    /** The model of this name (any case), or null if none has it. */
    public static SkyModel find(String name) {
        return name == null ? null : BY_NAME.get(name.trim().toLowerCase(Locale.ROOT));
    }

    /**
     * The model of this name (any case).
     *
     * @param where the flag or key named in the error message
     * @throws InputException listing the known names when none has this name
     */
    public static SkyModel byName(String name, String where) {
        SkyModel m = find(name);
        if (m == null) throw new InputException(where, "expected one of " + namesText() + ", got \"" + name + "\"");
        return m;
    }
}
