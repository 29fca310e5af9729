/**
 * Photovoltaic systems on the model: module data, module layout on roof zones and the yield chain
 * from plane-of-array irradiance to AC energy (docs/pv.md). Placed after {@code irradiation} and
 * before {@code metrics}: it uses the scene, the sun, the climate steps and the sky models, and the
 * PV zone metric uses it.
 */
package org.solmass.pv;
