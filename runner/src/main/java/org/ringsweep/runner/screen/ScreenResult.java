package org.ringsweep.runner.screen;

import java.util.List;

/**
 * The pre-screen figures of one net (SI units: s, V, V/s, Hz, ohm).
 *
 * @param net              the net name
 * @param file             the net file
 * @param driver           the driver pin
 * @param edgeRef          the levels the driver's {@code rise} is given between ({@code 10-90}, ...)
 * @param riseGiven        the driver's rise time between those levels (s)
 * @param rise1090         the 10–90 % rise time of the driver's linear ramp (s), the t_r of every rule below
 * @param swing            v_high − v_low (V)
 * @param slew             dV/dt of the ramp: swing over the full (0–100 %) transition, equal to the
 *                         slope over 10–90 % (V/s)
 * @param knee             knee frequency 0.5/t_r (Hz)
 * @param bandwidth        signal bandwidth 0.35/t_r (Hz)
 * @param totalDelay       sum of all segment delays (s)
 * @param longestDelay     the longest driver-to-receiver path delay (s)
 * @param farthest         the receiver at the end of that path
 * @param ratio            longestDelay / rise1090
 * @param lineClass        the classification of {@link LineClass}
 * @param z0               impedance of the longest segment on that path (ohm)
 * @param rOut             the driver's output resistance (mean of pull-up and pull-down, ohm)
 * @param rSeries          series resistors on that path (ohm)
 * @param gammaSource      source reflection coefficient (Rs − Z0)/(Rs + Z0), Rs = rOut + rSeries
 * @param gammaLoad        load reflection coefficient assumed (+1: high-impedance CMOS input)
 * @param launch           launched step Vi = swing·Z0/(Rs + Z0) (V)
 * @param farFirst         first far-end step Vi·(1 + ΓL) (V)
 * @param overshootFirst   farFirst − swing: how far the first arrival goes past the final level (V)
 * @param suggestedSeries  Z0 − rOut (ohm), NaN when rOut ≥ Z0
 * @param suggestedE24     the nearest IEC 60063 E24 value to it (ohm), NaN when none
 * @param notes            assumptions that limit the figures
 * @param pullUpWindow     for open-drain nets, the I²C pull-up window per mode (and whether the pull-up lies in it); empty otherwise
 */
public record ScreenResult(String net, String file, String driver, String edgeRef, double riseGiven, double rise1090,
        double swing, double slew, double knee, double bandwidth, double totalDelay, double longestDelay, String farthest,
        double ratio, LineClass lineClass, double z0, double rOut, double rSeries, double gammaSource, double gammaLoad,
        double launch, double farFirst, double overshootFirst, double suggestedSeries, double suggestedE24, List<String> notes,
        List<String> pullUpWindow) {
    /** The record format tag of {@code --json}. */
    public static final String FORMAT = "ringsweep/screen-1";

    /** Copies the notes. */
    public ScreenResult {
        notes = List.copyOf(notes);
        pullUpWindow = List.copyOf(pullUpWindow);
    }
}
