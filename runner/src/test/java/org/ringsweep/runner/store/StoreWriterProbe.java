package org.ringsweep.runner.store;

import java.nio.file.Path;
import org.ringsweep.runner.results.ResultRecord;

/**
 * A program for {@link StoreCrashTests}: commits {@link Records#numbered} points one after another
 * into the store under {@code args[0]} and prints the number of each committed point on its own
 * line after {@code put} returned, until it is killed.
 */
final class StoreWriterProbe {
    private StoreWriterProbe() {
    }

    /** @param args the output folder */
    public static void main(String[] args) {
        ResultStore store = ResultStore.open(Path.of(args[0]));
        for (int i = 0; i < 1_000_000; i++) {
            ResultRecord r = Records.numbered(i);
            store.put(r, PointKey.of(r));
            System.out.println(i);
            System.out.flush();
        }
        store.close();
    }
}
