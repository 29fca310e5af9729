package org.solmass.check;

/**
 * A plausibility warning.
 *
 * @param code  a stable short name of the check ("model-in-millimetres"), for tests and summary files
 * @param text  what looks wrong, the numbers behind it and the fix, in one sentence or two
 */
public record Warning(String code, String text) {
    @Override
    public String toString() {
        return text + " [" + code + "]";
    }
}
