package org.solmass.pv;

/**
 * Running sums of a PV array's {@link EnergyBalance} per month and for the whole period, with the
 * yields of IEC 61724-1 (reference yield Yr, final yield Yf, performance ratio PR = Yf / Yr).
 * Not thread-safe; add the steps in a fixed order (sums do not depend on thread count when one
 * thread adds them, or when per-thread totals are merged in a fixed order with {@link #add(YieldTotals)}).
 */
public final class YieldTotals {
    private final double arrayStcW;
    private final EnergyBalance[] month = new EnergyBalance[13];

    /** @param arrayStcW the array's STC power, W (modules x module STC power) */
    public YieldTotals(double arrayStcW) {
        if (!(arrayStcW > 0)) throw new IllegalArgumentException("array power must be positive: " + arrayStcW);
        this.arrayStcW = arrayStcW;
        java.util.Arrays.fill(month, EnergyBalance.ZERO);
    }

    /**
     * Adds one step.
     *
     * @param step       the step's energies (for one interval), Wh
     * @param monthOfYear 1..12
     * @param weightDays real days the step stands for ({@code climate.Step#weightDays()}: 1 for a year of steps)
     */
    public void add(EnergyBalance step, int monthOfYear, double weightDays) {
        if (monthOfYear < 1 || monthOfYear > 12) throw new IllegalArgumentException("month must be 1..12: " + monthOfYear);
        month[monthOfYear] = month[monthOfYear].plus(step.times(weightDays));
    }

    /** Adds another array's totals of the same STC power (e.g. a thread's share of the steps). */
    public void add(YieldTotals o) {
        for (int m = 1; m <= 12; m++) month[m] = month[m].plus(o.month[m]);
    }

    /** The array's STC power, W. */
    public double arrayStcW() { return arrayStcW; }

    /** Sums of one month (1..12), Wh. */
    public EnergyBalance month(int monthOfYear) { return month[monthOfYear]; }

    /** Sums of the whole period, Wh (months added in calendar order). */
    public EnergyBalance year() {
        EnergyBalance s = EnergyBalance.ZERO;
        for (int m = 1; m <= 12; m++) s = s.plus(month[m]);
        return s;
    }

    /** Reference yield Yr of a balance, kWh/kWp (= hours at 1 kW/m2). */
    public double referenceYield(EnergyBalance e) { return e.referenceWh() / arrayStcW; }

    /** Final (specific) yield Yf of a balance, kWh/kWp. */
    public double finalYield(EnergyBalance e) { return e.acWh() / arrayStcW; }
}
