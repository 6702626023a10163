package org.ringsweep.runner.store;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.sql.Types;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * The results journal of a sweep: {@code OUT/results.sqlite}, one row per finished point, keyed
 * by (net file hash, {@linkplain PointKey point key}).
 *
 * <p><b>Durability.</b> The database runs in WAL mode with {@code synchronous=FULL}: every
 * {@link #put} is its own transaction and returns only once the write-ahead log is synced to the
 * disk, so a committed point survives Ctrl-C, {@code kill -9} and a power cut; a point being
 * written at that moment is either wholly there or not at all. ({@code NORMAL} would survive a
 * killed process but could lose the last commits at a power cut.)
 *
 * <p><b>Keys.</b> {@code UNIQUE (net_hash, point_key)}. A {@code put} of a key that is already
 * there replaces that row (the newer result of the same point wins, e.g. after a re-run with
 * another engine version), and the row then counts as written last. A changed net file has
 * another hash, so its points are new keys; the old rows are kept, and {@link #bestPerNet()}
 * looks only at the net's latest hash.
 *
 * <p>Thread-safe: every method holds the store's lock, so there is one writer at a time. Other
 * processes (e.g. {@code sqlite3}) may read the file while a sweep writes it.
 */
public final class ResultStore implements AutoCloseable {
    /** The file name under the output folder. */
    public static final String FILE_NAME = "results.sqlite";
    /** The schema version this class writes and reads. */
    public static final int SCHEMA_VERSION = 1;

    private static final ObjectMapper MAPPER = new ObjectMapper();
    /** ISO-8601 UTC with milliseconds, fixed width, so the text sorts as the time does. */
    private static final DateTimeFormatter FINISHED_AT =
            DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSS'Z'", Locale.ROOT).withZone(ZoneOffset.UTC);

    /** The schema, as documented in {@code docs/results-store.md}. */
    static final List<String> SCHEMA = List.of(
            "CREATE TABLE schema_version (version INTEGER NOT NULL)",
            "CREATE TABLE points (\n"
                    + "  id INTEGER PRIMARY KEY,\n"
                    + "  net TEXT NOT NULL,\n"
                    + "  net_hash TEXT NOT NULL,\n"
                    + "  source TEXT NOT NULL,\n"
                    + "  corner TEXT NOT NULL,\n"
                    + "  point_key TEXT NOT NULL,\n"
                    + "  verdict TEXT NOT NULL CHECK (verdict IN ('pass', 'fail', 'error')),\n"
                    + "  worst_overshoot_v REAL,\n"
                    + "  worst_undershoot_v REAL,\n"
                    + "  worst_excursion_v REAL,\n"
                    + "  worst_ringback_margin_v REAL,\n"
                    + "  longest_settle_s REAL,\n"
                    + "  error TEXT,\n"
                    + "  finished_at TEXT NOT NULL,\n"
                    + "  record_json TEXT NOT NULL,\n"
                    + "  UNIQUE (net_hash, point_key)\n"
                    + ")",
            "CREATE INDEX points_by_net ON points (net)");

    private static final String COLUMNS = "id, net, net_hash, source, corner, point_key, verdict, worst_overshoot_v, "
            + "worst_undershoot_v, worst_excursion_v, worst_ringback_margin_v, longest_settle_s, error, finished_at, record_json";

    private final Path file;
    private final Connection connection;
    private final PreparedStatement insert;
    private final PreparedStatement exists;
    private boolean closed;

    private ResultStore(Path file, Connection connection) throws SQLException {
        this.file = file;
        this.connection = connection;
        this.insert = connection.prepareStatement("INSERT OR REPLACE INTO points (net, net_hash, source, corner, point_key, verdict, "
                + "worst_overshoot_v, worst_undershoot_v, worst_excursion_v, worst_ringback_margin_v, longest_settle_s, "
                + "error, finished_at, record_json) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)");
        this.exists = connection.prepareStatement("SELECT 1 FROM points WHERE net_hash = ? AND point_key = ? LIMIT 1");
    }

    /**
     * Opens {@code outDir/results.sqlite}, creating the folder, the file and its schema when
     * missing.
     *
     * @param outDir the output folder ({@code --out})
     * @return the open store; close it when the run ends
     * @throws StoreException when the file cannot be created, is not a results store, or was
     *                        written by a newer schema version
     */
    public static ResultStore open(Path outDir) {
        Path file = outDir.resolve(FILE_NAME);
        try {
            Files.createDirectories(outDir);
        } catch (IOException e) {
            throw new StoreException("cannot create the output folder `" + outDir + "`: " + e.getMessage(), e);
        }
        Connection c = null;
        try {
            c = DriverManager.getConnection("jdbc:sqlite:" + file.toAbsolutePath());
            try (Statement s = c.createStatement()) {
                s.executeUpdate("PRAGMA busy_timeout = 10000");
                try (ResultSet rs = s.executeQuery("PRAGMA journal_mode = WAL")) {
                    rs.next(); // WAL is persistent in the file; on a file system without it SQLite keeps its rollback journal
                }
                s.executeUpdate("PRAGMA synchronous = FULL");
            }
            prepareSchema(c, file);
            return new ResultStore(file, c);
        } catch (SQLException e) {
            closeQuietly(c);
            throw new StoreException("cannot open the results store `" + file + "`: " + e.getMessage(), e);
        } catch (StoreException e) {
            closeQuietly(c);
            throw e;
        }
    }

    private static void prepareSchema(Connection c, Path file) throws SQLException {
        c.setAutoCommit(false);
        try (Statement s = c.createStatement()) {
            Set<String> tables = new LinkedHashSet<>();
            try (ResultSet rs = s.executeQuery("SELECT name FROM sqlite_schema WHERE type = 'table'")) {
                while (rs.next()) {
                    tables.add(rs.getString(1));
                }
            }
            if (tables.isEmpty()) {
                for (String ddl : SCHEMA) {
                    s.executeUpdate(ddl);
                }
                s.executeUpdate("INSERT INTO schema_version (version) VALUES (" + SCHEMA_VERSION + ")");
            } else if (!tables.contains("schema_version") || !tables.contains("points")) {
                throw new StoreException("`" + file + "` is an SQLite database but not a ringsweep results store"
                        + " (expected the tables `schema_version` and `points`, found " + tables + ")", null);
            } else {
                try (ResultSet rs = s.executeQuery("SELECT max(version) FROM schema_version")) {
                    int version = rs.next() ? rs.getInt(1) : 0;
                    if (version != SCHEMA_VERSION) {
                        throw new StoreException("`" + file + "` has schema version `" + version + "`; this ringsweep reads version `"
                                + SCHEMA_VERSION + "`" + (version > SCHEMA_VERSION ? " (it was written by a newer ringsweep)" : ""), null);
                    }
                }
            }
            c.commit();
        } catch (SQLException | RuntimeException e) {
            c.rollback();
            throw e;
        } finally {
            c.setAutoCommit(true);
        }
    }

    /** The database file. */
    public Path file() {
        return file;
    }

    /**
     * Whether the point is already in the store.
     *
     * @param netHash  the net file's SHA-256 ({@link ResultRecord#sourceHash()})
     * @param pointKey the point key ({@link PointKey#of})
     */
    public synchronized boolean has(String netHash, String pointKey) {
        ensureOpen();
        try {
            exists.setString(1, netHash);
            exists.setString(2, pointKey);
            try (ResultSet rs = exists.executeQuery()) {
                return rs.next();
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
    }

    /**
     * The keys of the finished points of one net file, in the order they were written. Holds
     * every key as a string: for a large store use {@link #finished(String)}.
     *
     * @param netHash the net file's SHA-256
     * @return an unmodifiable set, empty when none
     */
    public synchronized Set<String> finishedKeys(String netHash) {
        ensureOpen();
        Set<String> keys = new LinkedHashSet<>();
        forEachKey(netHash, keys::add);
        return Collections.unmodifiableSet(keys);
    }

    /**
     * The finished points of one net file as a compact, exact membership test for
     * {@code --resume}: 8 bytes per stored point (a sorted array of 64-bit key hashes) instead
     * of the keys themselves; a hash that matches is confirmed against the store's own
     * {@code UNIQUE} index, so a hash collision never skips a point.
     *
     * @param netHash the net file's SHA-256
     * @return a snapshot taken now; points written later are not in it
     */
    public synchronized FinishedPoints finished(String netHash) {
        ensureOpen();
        long[][] hashes = {new long[1024]};
        int[] n = {0};
        forEachKey(netHash, key -> {
            if (n[0] == hashes[0].length) {
                hashes[0] = java.util.Arrays.copyOf(hashes[0], hashes[0].length * 2);
            }
            hashes[0][n[0]++] = FinishedPoints.hash(key);
        });
        return new FinishedPoints(netHash, java.util.Arrays.copyOf(hashes[0], n[0]), this);
    }

    private void forEachKey(String netHash, java.util.function.Consumer<String> action) {
        try (PreparedStatement q = connection.prepareStatement("SELECT point_key FROM points WHERE net_hash = ? ORDER BY id")) {
            q.setString(1, netHash);
            try (ResultSet rs = q.executeQuery()) {
                while (rs.next()) {
                    action.accept(rs.getString(1));
                }
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
    }

    /**
     * Commits one finished point; when this returns the row is on the disk. A row with the same
     * (net hash, point key) is replaced.
     *
     * @param r        the point's record; its {@code sourceHash} is the net hash
     * @param pointKey the point's key, normally {@link PointKey#of(ResultRecord)}
     * @throws IllegalArgumentException when the record has no source hash or the key is blank
     * @throws StoreException           when the write fails
     */
    public void put(ResultRecord r, String pointKey) {
        if (r.sourceHash() == null || r.sourceHash().isBlank()) {
            throw new IllegalArgumentException("the record of net `" + r.net() + "` has no source hash; the store keys points by it");
        }
        if (pointKey == null || pointKey.isBlank()) {
            throw new IllegalArgumentException("the point key of net `" + r.net() + "` is blank");
        }
        String json = ResultJson.line(r); // outside the lock: the JSON is the costly part
        PointSummary s = PointSummary.of(r);
        String finishedAt = FINISHED_AT.format(Instant.now());
        synchronized (this) {
            ensureOpen();
            try {
                insert.setString(1, r.net());
                insert.setString(2, r.sourceHash());
                insert.setString(3, r.source());
                insert.setString(4, r.corner());
                insert.setString(5, pointKey);
                insert.setString(6, r.verdict().word());
                setReal(7, s.worstOvershootV());
                setReal(8, s.worstUndershootV());
                setReal(9, s.worstExcursionV());
                setReal(10, s.worstRingbackMarginV());
                setReal(11, s.longestSettleS());
                if (r.error().isEmpty()) {
                    insert.setNull(12, Types.VARCHAR);
                } else {
                    insert.setString(12, r.error());
                }
                insert.setString(13, finishedAt);
                insert.setString(14, json);
                insert.executeUpdate(); // autocommit: one transaction per point
            } catch (SQLException e) {
                throw failure("write", e);
            }
        }
    }

    private void setReal(int index, double v) throws SQLException {
        if (Double.isFinite(v)) {
            insert.setDouble(index, v);
        } else {
            insert.setNull(index, Types.REAL);
        }
    }

    /** Every stored record as one line of JSON ({@code ringsweep/result-1}), in the order written; all in memory (small stores). */
    public List<String> recordLines() {
        List<String> lines = new ArrayList<>();
        forEachRecordLine(lines::add);
        return List.copyOf(lines);
    }

    /**
     * Hands every stored record, one line of JSON, to {@code action} in the order written, one
     * row at a time from a forward-only cursor: memory stays bounded whatever the store holds.
     * The store is locked meanwhile; {@code action} must not write to it.
     */
    public synchronized void forEachRecordLine(java.util.function.Consumer<String> action) {
        ensureOpen();
        try (Statement s = cursor(); ResultSet rs = s.executeQuery("SELECT record_json FROM points ORDER BY id")) {
            while (rs.next()) {
                action.accept(rs.getString(1));
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
    }

    /** Every row, in the order written (all net hashes); all in memory (small stores: see {@link #allRows()}). */
    public List<StoredRow> rows() {
        List<StoredRow> rows = new ArrayList<>();
        allRows().forEach(rows::add);
        return List.copyOf(rows);
    }

    /** Every row in the order written, streamed from a cursor each time it is walked (see {@link #forEachRecordLine}). */
    public RowSource allRows() {
        return action -> query("SELECT " + COLUMNS + " FROM points ORDER BY id", List.of(), action);
    }

    /** The rows of one net file in the order written, streamed from a cursor each time it is walked. */
    public RowSource rowsOf(String netHash) {
        return action -> query("SELECT " + COLUMNS + " FROM points WHERE net_hash = ? ORDER BY id", List.of(netHash), action);
    }

    /**
     * The first rows of one net name and file by point key (SQLite's binary text order, which is
     * {@link String#compareTo} order for keys without characters beyond U+FFFF).
     *
     * @param limit the most rows returned
     */
    public List<StoredRow> firstByPointKey(String net, String netHash, int limit) {
        List<StoredRow> rows = new ArrayList<>();
        query("SELECT " + COLUMNS + " FROM points WHERE net = ? AND net_hash = ? ORDER BY point_key LIMIT " + limit,
                List.of(net, netHash), rows::add);
        return List.copyOf(rows);
    }

    /** The stored row of one point, if it is there. */
    public java.util.Optional<StoredRow> row(String netHash, String pointKey) {
        List<StoredRow> rows = new ArrayList<>(1);
        query("SELECT " + COLUMNS + " FROM points WHERE net_hash = ? AND point_key = ?", List.of(netHash, pointKey), rows::add);
        return rows.stream().findFirst();
    }

    /** Whether the store holds no row at all. */
    public synchronized boolean isEmpty() {
        ensureOpen();
        try (Statement s = connection.createStatement(); ResultSet rs = s.executeQuery("SELECT 1 FROM points LIMIT 1")) {
            return !rs.next();
        } catch (SQLException e) {
            throw failure("read", e);
        }
    }

    /**
     * Verdict counts of one net file's rows, counted by SQLite (nothing per row comes to Java).
     *
     * @return net name → counts, nets in the order of their first row
     */
    public synchronized Map<String, VerdictCounts> counts(String netHash) {
        ensureOpen();
        Map<String, long[]> raw = new HashMap<>(); // net → pass, fail, error, first id
        try (PreparedStatement q = connection.prepareStatement(
                "SELECT net, verdict, count(*), min(id) FROM points WHERE net_hash = ? GROUP BY net, verdict")) {
            q.setString(1, netHash);
            try (ResultSet rs = q.executeQuery()) {
                while (rs.next()) {
                    long[] c = raw.computeIfAbsent(rs.getString(1), k -> new long[] {0, 0, 0, Long.MAX_VALUE});
                    c[Verdict.valueOf(rs.getString(2).toUpperCase(Locale.ROOT)).ordinal()] += rs.getLong(3);
                    c[3] = Math.min(c[3], rs.getLong(4));
                }
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
        List<Map.Entry<String, long[]>> nets = new ArrayList<>(raw.entrySet());
        nets.sort(java.util.Comparator.comparingLong(e -> e.getValue()[3]));
        Map<String, VerdictCounts> out = new LinkedHashMap<>();
        for (Map.Entry<String, long[]> e : nets) {
            long[] c = e.getValue();
            out.put(e.getKey(), new VerdictCounts(c[Verdict.PASS.ordinal()], c[Verdict.FAIL.ordinal()], c[Verdict.ERROR.ordinal()]));
        }
        return Collections.unmodifiableMap(out);
    }

    /**
     * The best point of each net by the default objective (see {@code docs/results-store.md}):
     * passes every limit first, then the smallest worst excursion beyond the rails, then the
     * shortest longest settling time, then point order; error points are never best. Only the
     * net's latest net file counts: the hash of the row written last for that net name.
     *
     * <p>One pass over a cursor of the summary columns, keeping one candidate per net (the
     * point order is read from the point key, whose values are the record's exactly); only the
     * winners' whole rows are read. Memory does not grow with the store.
     *
     * @return net name → best row, nets in the order of their first row; a net whose latest file
     *         has only error points has no entry
     */
    public synchronized Map<String, StoredRow> bestPerNet() {
        ensureOpen();
        Map<String, String> latestHash = new LinkedHashMap<>();
        Map<String, BestPoint.Candidate> best = new LinkedHashMap<>();
        try (Statement s = connection.createStatement();
             ResultSet rs = s.executeQuery("SELECT p.net, p.net_hash FROM points AS p JOIN (SELECT net, max(id) AS last, min(id) AS first"
                     + " FROM points GROUP BY net) AS l ON p.id = l.last ORDER BY l.first")) {
            while (rs.next()) {
                latestHash.put(rs.getString(1), rs.getString(2));
                best.put(rs.getString(1), null);
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
        try (PreparedStatement q = connection.prepareStatement("SELECT id, corner, point_key, verdict, worst_excursion_v, longest_settle_s"
                + " FROM points WHERE net = ? AND net_hash = ? AND verdict <> 'error'")) {
            for (Map.Entry<String, String> net : latestHash.entrySet()) {
                q.setString(1, net.getKey());
                q.setString(2, net.getValue());
                try (ResultSet rs = q.executeQuery()) {
                    while (rs.next()) {
                        BestPoint.Candidate c = new BestPoint.Candidate(rs.getLong(1), rs.getString(2), rs.getString(3),
                                Verdict.valueOf(rs.getString(4).toUpperCase(Locale.ROOT)), real(rs, 5), real(rs, 6));
                        BestPoint.Candidate current = best.get(net.getKey());
                        if (current == null || BestPoint.CANDIDATE_ORDER.compare(c, current) < 0) {
                            best.put(net.getKey(), c);
                        }
                    }
                }
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
        Map<String, StoredRow> out = new LinkedHashMap<>();
        best.forEach((net, c) -> {
            if (c != null) {
                query("SELECT " + COLUMNS + " FROM points WHERE id = ?", List.of(c.id()), r -> out.put(net, r));
            }
        });
        return Collections.unmodifiableMap(out);
    }

    /**
     * Each net's latest net file: the hash of the row written last for that net name.
     *
     * @return net name → net hash, nets in the order of the first row of that file
     */
    public synchronized Map<String, String> latestFiles() {
        ensureOpen();
        Map<String, String> out = new LinkedHashMap<>();
        try (Statement s = connection.createStatement();
             ResultSet rs = s.executeQuery("SELECT p.net, p.net_hash FROM points AS p JOIN (SELECT net, max(id) AS last FROM points"
                     + " GROUP BY net) AS l ON p.id = l.last ORDER BY (SELECT min(id) FROM points AS q WHERE q.net_hash = p.net_hash"
                     + " AND q.net = p.net)")) {
            while (rs.next()) {
                out.put(rs.getString(1), rs.getString(2));
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
        return Collections.unmodifiableMap(out);
    }

    /** The number of rows (all net files). */
    public synchronized long size() {
        ensureOpen();
        try (Statement s = connection.createStatement(); ResultSet rs = s.executeQuery("SELECT count(*) FROM points")) {
            rs.next();
            return rs.getLong(1);
        } catch (SQLException e) {
            throw failure("read", e);
        }
    }

    /**
     * The rows of one net file that a sampled report must not leave out: the worst of each
     * summary column (largest overshoot, undershoot and settling time, smallest ringback
     * margin), the first point whose settling time is unknown, and the first fail and error
     * point. Found by SQLite, one scan of the net's rows each.
     *
     * @return their ids
     */
    public synchronized Set<Long> notableIds(String net, String netHash) {
        ensureOpen();
        Set<Long> ids = new LinkedHashSet<>();
        List<String> picks = List.of(
                "worst_overshoot_v IS NOT NULL ORDER BY worst_overshoot_v DESC, id",
                "worst_undershoot_v IS NOT NULL ORDER BY worst_undershoot_v DESC, id",
                "longest_settle_s IS NOT NULL ORDER BY longest_settle_s DESC, id",
                "worst_ringback_margin_v IS NOT NULL ORDER BY worst_ringback_margin_v, id",
                "longest_settle_s IS NULL AND verdict <> 'error' ORDER BY id",
                "verdict = 'fail' ORDER BY id",
                "verdict = 'error' ORDER BY id");
        for (String pick : picks) {
            try (PreparedStatement q = connection.prepareStatement("SELECT id FROM points WHERE net = ? AND net_hash = ? AND " + pick
                    + " LIMIT 1")) {
                q.setString(1, net);
                q.setString(2, netHash);
                try (ResultSet rs = q.executeQuery()) {
                    if (rs.next()) {
                        ids.add(rs.getLong(1));
                    }
                }
            } catch (SQLException e) {
                throw failure("read", e);
            }
        }
        return Collections.unmodifiableSet(ids);
    }

    /** A forward-only, read-only statement (sqlite-jdbc steps such a cursor one row at a time). */
    private Statement cursor() throws SQLException {
        Statement s = connection.createStatement(ResultSet.TYPE_FORWARD_ONLY, ResultSet.CONCUR_READ_ONLY);
        s.setFetchSize(256);
        return s;
    }

    private synchronized void query(String sql, List<Object> args, java.util.function.Consumer<? super StoredRow> action) {
        ensureOpen();
        try (PreparedStatement q = connection.prepareStatement(sql, ResultSet.TYPE_FORWARD_ONLY, ResultSet.CONCUR_READ_ONLY)) {
            q.setFetchSize(256);
            for (int i = 0; i < args.size(); i++) {
                q.setObject(i + 1, args.get(i));
            }
            try (ResultSet rs = q.executeQuery()) {
                while (rs.next()) {
                    action.accept(row(rs));
                }
            }
        } catch (SQLException e) {
            throw failure("read", e);
        }
    }

    private StoredRow row(ResultSet rs) throws SQLException {
        String json = rs.getString(15);
        String error = rs.getString(13);
        return new StoredRow(rs.getLong(1), rs.getString(2), rs.getString(3), rs.getString(4), rs.getString(5), rs.getString(6),
                point(json), Verdict.valueOf(rs.getString(7).toUpperCase(Locale.ROOT)), real(rs, 8), real(rs, 9), real(rs, 10),
                real(rs, 11), real(rs, 12), error == null ? "" : error, Instant.parse(rs.getString(14)), json);
    }

    private static double real(ResultSet rs, int index) throws SQLException {
        double v = rs.getDouble(index);
        return rs.wasNull() ? Double.NaN : v;
    }

    private Map<String, Double> point(String json) {
        try {
            JsonNode p = MAPPER.readTree(json).path("point");
            Map<String, Double> point = new LinkedHashMap<>();
            for (Map.Entry<String, JsonNode> e : p.properties()) {
                point.put(e.getKey(), e.getValue().isNumber() ? e.getValue().doubleValue() : Double.NaN);
            }
            return point;
        } catch (IOException e) {
            throw new StoreException("a record in `" + file + "` is not valid JSON: " + e.getMessage(), e);
        }
    }

    private void ensureOpen() {
        if (closed) {
            throw new IllegalStateException("the results store `" + file + "` is closed");
        }
    }

    private StoreException failure(String what, SQLException e) {
        return new StoreException("cannot " + what + " the results store `" + file + "`: " + e.getMessage(), e);
    }

    /** Closes the file (checkpointing the write-ahead log into it). Idempotent. */
    @Override
    public synchronized void close() {
        if (closed) {
            return;
        }
        closed = true;
        try {
            insert.close();
            exists.close();
            connection.close();
        } catch (SQLException e) {
            throw failure("close", e);
        }
    }

    private static void closeQuietly(Connection c) {
        if (c != null) {
            try {
                c.close();
            } catch (SQLException ignored) {
                // the open failure is what the user must see
            }
        }
    }
}
