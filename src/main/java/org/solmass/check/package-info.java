/**
 * Plausibility checks: inputs that parse but are probably wrong (a unit, an axis, a time zone, a
 * column unit, a swapped coordinate). Each check gives a warning that says what looks wrong, why,
 * and how to fix it; none stops a run. Imports model, climate and sun only.
 */
package org.solmass.check;
