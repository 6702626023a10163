package org.ringsweep.runner.raw;

import java.util.List;

/**
 * One plot of an ngspice raw file: header facts and the real data, column by column.
 *
 * @param title          the {@code Title:} line
 * @param plotName       the {@code Plotname:} line (e.g. {@code Transient Analysis})
 * @param flags          the {@code Flags:} line (e.g. {@code real})
 * @param variables      variable names in header order, lower-case as ngspice writes them
 * @param declaredPoints the {@code No. Points:} value
 * @param columns        one array per variable, same order; for complex data the real parts
 * @param truncated      whether fewer complete records were present than declared (or the count was 0)
 */
public record RawPlot(String title, String plotName, String flags, List<String> variables,
                      int declaredPoints, List<double[]> columns, boolean truncated) {
    /** Copies the lists. */
    public RawPlot {
        variables = List.copyOf(variables);
        columns = List.copyOf(columns);
    }

    /** Number of records actually read. */
    public int points() {
        return columns.isEmpty() ? 0 : columns.get(0).length;
    }

    /** The column of a variable by name (case-insensitive), e.g. {@code v(u7_6)} or {@code time}. */
    public java.util.Optional<double[]> column(String name) {
        for (int i = 0; i < variables.size(); i++) {
            if (variables.get(i).equalsIgnoreCase(name)) {
                return java.util.Optional.of(columns.get(i));
            }
        }
        return java.util.Optional.empty();
    }

    /** Whether {@code Flags:} says {@code complex} (the columns then hold the real parts). */
    public boolean isComplex() {
        for (String token : flags.strip().split("[ \t]+")) {
            if (token.equalsIgnoreCase("complex")) {
                return true;
            }
        }
        return false;
    }
}
