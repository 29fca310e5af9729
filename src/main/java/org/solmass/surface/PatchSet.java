package org.solmass.surface;

import org.solmass.model.MassingModel;

import java.util.List;

/**
 * The surfaces of a model and the patches of its analysed surfaces.
 *
 * @param model the model they were built from
 * @param options the patching options used
 * @param surfaces all planar surfaces of all blocks, index = surface id
 * @param patches patches in dense index order (grouped by surface, surfaces in id order)
 * @param analysedBlocks per block id, whether its surfaces were patched
 * @param hasGroundFaces whether the model has surfaces classified GROUND (in any block)
 * @param groundLevelZ the model's lowest level, metres (z of the infinite ground plane the scene
 *                     stage adds when {@code hasGroundFaces} is false)
 */
public record PatchSet(MassingModel model, PatchOptions options, List<Surface> surfaces, List<Patch> patches,
                       boolean[] analysedBlocks, boolean hasGroundFaces, double groundLevelZ) {

    /** Whether block {@code block} was analysed (patched). */
    public boolean isAnalysed(int block) { return analysedBlocks[block]; }

    public int patchCount() { return patches.size(); }

    /** Number of patches of each kind (every kind present as a key, in enum order). */
    public java.util.Map<SurfaceKind, Integer> patchCountByKind() {
        java.util.Map<SurfaceKind, Integer> m = new java.util.EnumMap<>(SurfaceKind.class);
        for (SurfaceKind k : SurfaceKind.values()) m.put(k, 0);
        for (Patch p : patches) m.merge(p.kind(), 1, Integer::sum);
        return m;
    }

    /**
     * Area of the analysed surfaces left unpatched because it faces a touching block
     * ({@link HiddenFaces}), square metres (undersides, unless patched, are not counted).
     */
    public double hiddenAreaM2() {
        double all = 0;
        for (Surface s : surfaces) {
            if (!analysedBlocks[s.block()]) continue;
            if (s.kind() == SurfaceKind.UNDERSIDE && !options.includeUndersides()) continue;
            all += s.areaM2();
        }
        return Math.max(0, all - totalPatchAreaM2());
    }

    /** Sum of the patch areas, square metres. */
    public double totalPatchAreaM2() {
        double s = 0;
        for (Patch p : patches) s += p.areaM2();
        return s;
    }
}
