package org.solmass.surface;

import org.solmass.model.SemanticKind;
import org.solmass.model.Vec3;

/**
 * Classifies a planar surface from its unit normal and height. Thresholds (common practice for
 * massing studies; chosen here, not from a standard):
 * <ul>
 *   <li>FACADE: near-vertical, {@code |nz| <= sin 10 deg} ({@link #FACADE_MAX_ABS_NZ}), i.e. tilt 80..100 deg;</li>
 *   <li>UNDERSIDE: faces down, {@code nz < -sin 10 deg} (tilt above 100 deg);</li>
 *   <li>GROUND: faces up ({@code nz > sin 10 deg}) and its highest point is within
 *       {@link #GROUND_TOLERANCE_M} of the model's lowest level;</li>
 *   <li>ROOF: every other up-facing surface, sloped roofs included.</li>
 * </ul>
 */
public final class SurfaceClassifier {
    /** Facade tilt band half-width around vertical, degrees. */
    public static final double FACADE_BAND_DEG = 10.0;
    /** {@code sin(FACADE_BAND_DEG)}: surfaces with {@code |nz|} at most this are facades. */
    public static final double FACADE_MAX_ABS_NZ = Math.sin(Math.toRadians(FACADE_BAND_DEG));
    /** An up-facing surface whose highest point is at most this far above the ground level is GROUND, metres. */
    public static final double GROUND_TOLERANCE_M = 0.1;

    private SurfaceClassifier() {}

    /**
     * @param normal unit front-side normal
     * @param maxZ highest z of the surface, metres
     * @param groundLevelZ the model's lowest level, metres
     */
    public static SurfaceKind classify(Vec3 normal, double maxZ, double groundLevelZ) {
        double nz = normal.z();
        if (Math.abs(nz) <= FACADE_MAX_ABS_NZ) return SurfaceKind.FACADE;
        if (nz < 0) return SurfaceKind.UNDERSIDE;
        return maxZ <= groundLevelZ + GROUND_TOLERANCE_M ? SurfaceKind.GROUND : SurfaceKind.ROOF;
    }

    /**
     * The kind of a surface whose file declares what it is ({@link SemanticKind}): a roof (and an
     * outside floor such as a terrace) is ROOF, a wall FACADE, the building's floor on the ground and
     * an outside ceiling UNDERSIDE (they face down), whatever their tilt; a surface with nothing
     * declared is classified by its normal ({@link #classify(Vec3, double, double)}).
     */
    public static SurfaceKind classify(SemanticKind declared, Vec3 normal, double maxZ, double groundLevelZ) {
        return switch (declared) {
            case ROOF, OUTER_FLOOR -> SurfaceKind.ROOF;
            case WALL -> SurfaceKind.FACADE;
            case GROUND, OUTER_CEILING -> SurfaceKind.UNDERSIDE;
            case NONE -> classify(normal, maxZ, groundLevelZ);
        };
    }

    /** Tilt from horizontal, degrees: 0 faces up, 90 vertical, 180 faces down. */
    public static double tiltDeg(Vec3 n) {
        return Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, n.z()))));
    }

    /**
     * Azimuth of the normal's horizontal part, degrees from north clockwise in [0, 360); 0 when the
     * normal is vertical (no horizontal part).
     */
    public static double azimuthDeg(Vec3 n) {
        if (Math.hypot(n.x(), n.y()) < SurfaceFrame.VERTICAL_NORMAL_EPS) return 0.0;
        double a = Math.toDegrees(Math.atan2(n.x(), n.y()));
        if (a < 0) a += 360.0;
        return a >= 360.0 ? 0.0 : a;
    }
}
