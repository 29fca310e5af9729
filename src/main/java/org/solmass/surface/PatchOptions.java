package org.solmass.surface;

import org.solmass.InputException;

import java.util.Set;

/**
 * How surfaces are split into patches.
 *
 * @param patchSizeM side of the square grid cells, metres (default 1.0)
 * @param analysedBlocks names of the blocks to patch; empty = all blocks
 * @param includeUndersides whether down-facing surfaces get patches (default false)
 */
public record PatchOptions(double patchSizeM, Set<String> analysedBlocks, boolean includeUndersides) {
    public static final double DEFAULT_PATCH_SIZE_M = 1.0;

    public PatchOptions {
        if (!(patchSizeM > 0) || !Double.isFinite(patchSizeM)) {
            throw new InputException("patch size", "patch size must be a positive number of metres, got " + patchSizeM);
        }
        analysedBlocks = analysedBlocks == null ? Set.of() : Set.copyOf(analysedBlocks);
    }

    /** 1 m patches, all blocks, no undersides. */
    public static PatchOptions defaults() { return new PatchOptions(DEFAULT_PATCH_SIZE_M, Set.of(), false); }
}
