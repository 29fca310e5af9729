package org.solmass.surface;

import org.solmass.model.Vec3;

/**
 * One grid patch of an analysed surface: the unit Solmass computes and reports values for.
 *
 * @param index dense 0-based index in the patch set (array index of every per-patch result)
 * @param id stable id across runs of the same model and options, e.g. {@code B3-S12-P0045}
 * @param block block id (index into {@code MassingModel.blockNames()})
 * @param blockName block name
 * @param surface surface id (index into {@code PatchSet.surfaces()})
 * @param kind roof, facade, ground or underside
 * @param centroid area centroid, metres (x east, y north, z up)
 * @param normal unit outward normal
 * @param areaM2 area in square metres
 * @param tiltDeg tilt from horizontal, degrees (0 = faces up, 90 = vertical, 180 = faces down)
 * @param azimuthDeg azimuth of the normal's horizontal part, degrees from north clockwise; 0 for horizontal
 * @param outline the patch polygon as x,y,z triples (metres), counter-clockwise seen from the front,
 *                not closed (last corner is not a repeat of the first)
 */
public record Patch(int index, String id, int block, String blockName, int surface, SurfaceKind kind,
                    Vec3 centroid, Vec3 normal, double areaM2, double tiltDeg, double azimuthDeg,
                    double[] outline) {
}
