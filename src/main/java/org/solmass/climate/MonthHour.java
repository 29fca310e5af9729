package org.solmass.climate;

/**
 * The 12 x 24 month-hour slots that results and climate glances are summed into: slot
 * {@code (month - 1) * 24 + hour}, month 1..12 and hour 0..23 of local standard time, 288 slots.
 * A step falls into the slot of its month and the whole hour of its start
 * ({@link #slotOf(Step)}), so an hour column hNN covers NN:00 to NN+1:00 local standard time.
 */
public final class MonthHour {
    private MonthHour() {}

    public static final int MONTHS = 12, HOURS = 24;
    /** Number of month-hour slots (12 x 24). */
    public static final int SLOTS = MONTHS * HOURS;

    /** Slot of month 1..12 and local standard hour 0..23. */
    public static int index(int month, int hour) {
        return (month - 1) * HOURS + hour;
    }

    /** Month 1..12 of a slot. */
    public static int month(int index) {
        return index / HOURS + 1;
    }

    /** Local standard hour 0..23 of a slot. */
    public static int hour(int index) {
        return index % HOURS;
    }

    /** Slot of a step: its month and the whole hour of its local standard start time (kept within 0..23). */
    public static int slotOf(Step st) {
        int h = Math.min(HOURS - 1, Math.max(0, (int) Math.floor(st.localStandardHour())));
        return index(st.month(), h);
    }
}
