package org.solmass.spark;

import org.apache.spark.Partitioner;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaPairRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.api.java.Optional;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.storage.StorageLevel;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.StagedPasses;
import org.solmass.irradiation.TileBounces;
import org.solmass.metrics.ColumnCatalogue;
import org.solmass.metrics.PvZones;
import org.solmass.table.Column;
import org.solmass.tiles.CityModel;
import org.solmass.tiles.CityPlan;
import org.solmass.tiles.CityTables;
import org.solmass.tiles.Tile;
import scala.Tuple2;

import java.io.IOException;
import java.io.Serializable;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.IntStream;

/**
 * The stages of a city run as Spark jobs over the tiles of a {@link CityPlan} (docs/city.md):
 * <ol>
 * <li>first pass, one task per partition of tiles ({@link TilePartitioner}), tile by tile ({@link CityModel#firstPass}); each tile's {@link FirstPasses}
 * stay where they were computed (persisted, partitioned by tile);</li>
 * <li>exchange and bounces, month space: once, each tile works out from its reflector lists and the
 * plan which receivers it needs from which other tile ({@link TileExchange.Route}) and sends each
 * owner one request; then per bounce each tile sends every tile that asked one packet of flat
 * arrays (the last terms of the ids asked for), in one shuffle grouped by receiving tile, and each
 * tile computes its receivers' next term from its own values and the packets
 * ({@link TileBounces}); the driver adds the tiles' energies in tile order for the stopping rule;
 * then, once, the receivers' annual totals for the standard error;</li>
 * <li>finish, tile by tile in the same partitions ({@link CityModel#finish}): the rows of patches.csv, written as
 * Parquet partitioned by tile, with the PV zones numbered as the whole model numbers them.</li>
 * </ol>
 * Each task rebuilds the prepared study from its file once per JVM ({@link #city}) with the weather,
 * sun and sky tables the driver computed and broadcast ({@link CityTables}); in local mode the
 * driver's own prepared study is used. A task that fails is
 * retried by Spark from the persisted stage before it; Spark's file commit keeps only one attempt's
 * rows per tile.
 */
final class CityStages {
    private CityStages() {}

    /**
     * What every task needs besides the plan ({@link Serializable}).
     *
     * @param studyFile the study file (absolute), read once per JVM
     * @param failOnceTile test hook: this tile's task fails on its first attempt at {@code failOnceStage}; -1 for none
     * @param failOnceStage "first-pass", "bounce", "finish" or "write"
     * @param holdFile test hook ({@link #HOLD_KEY}): the first bounce's tasks write {@code holdFile + ".waiting"} and
     *                 wait until {@code holdFile} exists (at most {@link #HOLD_MAX_S} s); null for none
     */
    record Settings(String studyFile, int failOnceTile, String failOnceStage, String holdFile) implements Serializable {
        static Settings of(Path study) { return new Settings(study.toAbsolutePath().normalize().toString(), -1, "", null); }

        Settings failingOnce(int tile, String stage) { return new Settings(studyFile, tile, stage, holdFile); }

        Settings holding(String file) { return new Settings(studyFile, failOnceTile, failOnceStage, file); }
    }

    /**
     * Spark setting of a test hook (CityClusterIT): a file path; the first bounce's tasks wait until it
     * exists, so that a test can kill an executor while tasks run, once the first pass is cached.
     */
    static final String HOLD_KEY = "spark.solmass.test.holdBounceUntil";
    static final int HOLD_MAX_S = 120;

    static void holdIfAsked(Settings s) {
        if (s.holdFile() == null) return;
        Path release = Path.of(s.holdFile());
        try {
            Files.writeString(Path.of(s.holdFile() + ".waiting"), "waiting\n", java.nio.file.StandardOpenOption.CREATE,
                    java.nio.file.StandardOpenOption.APPEND);
            for (int i = 0; i < HOLD_MAX_S * 10 && !Files.exists(release); i++) Thread.sleep(100);
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /**
     * What the stages produced (the Parquet rows are in {@code parquet}); {@code zones}: the PV zones
     * with their city-wide numbers, in number order, or null when the run finds no PV zones ({@code zoneRows}:
     * their zones.csv rows, or null likewise);
     * {@code buildings}: per block the means of the {@code summarised} columns ({@link BuildingSummaries});
     * {@code stageCpuS}: per stage the driver JVM's CPU seconds (all its threads; in local mode the tasks' too; NaN where the JVM does not tell);
     * {@code partitions}: the partitions the tiles were grouped into ({@link #partitionCount}).
     */
    record Outcome(List<Column> columns, double[] bounceWh, boolean converged, long rows, long[] firstPassBytes,
                   Map<String, Double> stageS, List<PvZones.Zone> zones, TileOut.ZoneRows zoneRows, List<Column> summarised,
                   List<org.solmass.output.BuildingsWriter.Building> buildings, Map<String, Double> stageCpuS, int partitions) {}

    private static final Map<String, CityModel> CITIES = new ConcurrentHashMap<>();

    /**
     * The prepared study of this JVM: on first use read from its file with the driver's tables
     * ({@link CityTables}: weather, sun directions, step table), which are not computed again.
     */
    static CityModel city(String studyFile, Broadcast<byte[]> tables) {
        return CITIES.computeIfAbsent(studyFile, f -> CityModel.load(Path.of(f), CityTables.decode(tables.value())));
    }

    /** Makes the driver's prepared study the one its local tasks use. */
    static void share(String studyFile, CityModel city) {
        CITIES.put(studyFile, city);
    }

    /** Forgets the prepared studies (after a run). */
    static void forget(String studyFile) {
        CITIES.remove(studyFile);
    }

    /**
     * The cores Spark gave the running task ({@code spark.task.cpus}, 1 by default): a tile's first
     * pass and finish run their parallel loops on that many threads of their own
     * ({@link CityModel#firstPass(Tile, int)}), not in the JVM's common pool that every task of an
     * executor would share. 0 (the caller's pool) outside a task.
     */
    static int taskCores() {
        TaskContext tc = TaskContext.get();
        return tc == null ? 0 : tc.cpus();
    }

    /** The key of a (tile, tile-local PV zone) pair. */
    static long zoneKey(int tile, int localZone) {
        return ((long) tile << 32) | (localZone & 0xffffffffL);
    }

    /**
     * Partitions of tiles per core of the cluster ({@code spark.default.parallelism}; local mode: the
     * cores given): enough tasks per stage for Spark to even out unequal tiles, few enough that a
     * stage is not mostly task launches and a shuffle not mostly empty blocks (a shuffle grouped by
     * tile has partitions x partitions blocks). Measured: docs/city.md, "Faster metrics on both sides, tiles grouped into partitions".
     */
    static final int PARTITIONS_PER_CORE = 4;
    /** The Spark setting that overrides {@link #PARTITIONS_PER_CORE} ({@code --conf} of spark-submit, or a {@code spark.*} system property). */
    static final String PARTITIONS_PER_CORE_KEY = "spark.solmass.city.partitionsPerCore";

    /**
     * Receivers a partition holds at most, about (the greedy grouping may pass it by one tile): a task
     * keeps its partition's first-pass sums together (the joins between stages, the persisted blocks),
     * about 1.5 kB per receiver ("Task memory" in docs/city.md), so about 300 MB; a tile's scene is
     * built and dropped tile by tile and does not add up.
     */
    static final long MAX_RECEIVERS_PER_PARTITION = 200_000;

    /**
     * The partitions of a run: {@link #partitionsPerCore} x the cores Spark reports, at least as many
     * as keep each under {@link #MAX_RECEIVERS_PER_PARTITION}, at most one per tile. The cores are
     * known in local mode and where {@code spark.default.parallelism} is set; on a cluster without it
     * the executors may not have registered when the run starts (Spark then reports too few cores), so
     * each tile gets a partition of its own.
     */
    static int partitionCount(org.apache.spark.SparkContext sc, CityPlan plan) {
        int tiles = plan.tiles().size();
        boolean coresKnown = sc.master().startsWith("local") || sc.conf().contains("spark.default.parallelism");
        if (!coresKnown) return Math.max(1, tiles);
        long byCores = (long) partitionsPerCore(sc.conf()) * Math.max(1, sc.defaultParallelism());
        long byMemory = (plan.receiverCount() + MAX_RECEIVERS_PER_PARTITION - 1) / MAX_RECEIVERS_PER_PARTITION;
        return (int) Math.max(1, Math.min(tiles, Math.max(byCores, byMemory)));
    }

    /** {@link #PARTITIONS_PER_CORE}, or what {@code conf} sets under {@link #PARTITIONS_PER_CORE_KEY} (a whole number from 1). */
    static int partitionsPerCore(org.apache.spark.SparkConf conf) {
        String v = conf.get(PARTITIONS_PER_CORE_KEY, Integer.toString(PARTITIONS_PER_CORE)).trim();
        int n;
        try {
            n = Integer.parseInt(v);
        } catch (NumberFormatException e) {
            n = 0;
        }
        if (n < 1) throw new org.solmass.InputException(PARTITIONS_PER_CORE_KEY, "expected a whole number from 1, got '" + v + "'");
        return n;
    }

    /**
     * The tiles grouped into {@code partitions} partitions (at most one per tile), balanced by
     * receivers: tiles largest first (most receivers), each to the partition with the fewest receivers
     * so far (longest processing time first: Graham, "Bounds on multiprocessing timing anomalies", SIAM
     * J. Appl. Math. 17, 1969, from memory); the partitions are numbered by their receivers, most
     * first, since Spark starts a stage's tasks in partition order, so the last tasks of the first
     * pass and the finish are short ones. Every stage uses this partitioner, so the joins between
     * stages stay within a partition. Nothing else depends on the grouping: a task works its tiles
     * one after the other, each as it would alone.
     */
    static final class TilePartitioner extends Partitioner {
        private final int[] partitionOf;
        private final int partitions;

        TilePartitioner(CityPlan plan, int partitions) {
            int n = plan.tiles().size();
            this.partitions = Math.max(1, Math.min(n, partitions));
            Integer[] order = new Integer[n];
            for (int i = 0; i < n; i++) order[i] = i;
            Arrays.sort(order, (a, b) -> {
                int c = Integer.compare(plan.tile(b).receivers().length, plan.tile(a).receivers().length);
                return c != 0 ? c : Integer.compare(a, b);
            });
            long[] load = new long[this.partitions];
            int[] group = new int[n];
            for (int t : order) {
                int best = 0;
                for (int g = 1; g < load.length; g++) if (load[g] < load[best]) best = g;
                group[t] = best;
                load[best] += plan.tile(t).receivers().length;
            }
            Integer[] rank = new Integer[this.partitions];
            for (int g = 0; g < rank.length; g++) rank[g] = g;
            Arrays.sort(rank, (a, b) -> {
                int c = Long.compare(load[b], load[a]);
                return c != 0 ? c : Integer.compare(a, b);
            });
            int[] numberOf = new int[this.partitions];
            for (int k = 0; k < rank.length; k++) numberOf[rank[k]] = k;
            partitionOf = new int[n];
            for (int t = 0; t < n; t++) partitionOf[t] = numberOf[group[t]];
        }

        @Override public int numPartitions() { return partitions; }

        @Override public int getPartition(Object key) { return partitionOf[(Integer) key]; }

        @Override public boolean equals(Object o) { return o instanceof TilePartitioner t && t.partitions == partitions && Arrays.equals(t.partitionOf, partitionOf); }

        @Override public int hashCode() { return Arrays.hashCode(partitionOf); }
    }

    /** A tile's reflection sums between bounces ({@link Serializable}; a new one per bounce, sharing ids and route). */
    static final class TileState implements Serializable {
        private static final long serialVersionUID = 1L;
        final int tile;
        final int[] ids;
        /** Where its reflector lists read and what it receives ({@link TileExchange.Route}). */
        final TileExchange.Route route;
        /** The last term (entry x 12), reflected months so far (entry x 12), first pass + reflected per entry, Wh/m2. */
        final double[] term, reflMonth, totalAnnual;
        /** The last term's energy over the tile's analysed patches. */
        final double added;

        TileState(int tile, int[] ids, TileExchange.Route route, double[] term, double[] reflMonth, double[] totalAnnual, double added) {
            this.tile = tile;
            this.ids = ids;
            this.route = route;
            this.term = term;
            this.reflMonth = reflMonth;
            this.totalAnnual = totalAnnual;
            this.added = added;
        }

        static TileState initial(int tile, FirstPasses fp, int[] owner) {
            return new TileState(tile, fp.ids(), TileExchange.Route.of(tile, fp, owner), TileBounces.firstPassMonths(fp),
                    new double[12 * fp.size()], TileBounces.firstPassAnnual(fp), 0);
        }

        /** The next term from the packets received (the other tiles' last terms this tile needs). */
        TileState next(FirstPasses fp, Optional<Iterable<TileExchange.Packet>> got, boolean first, double[] ghiMonth, int analysedTotal) {
            double[] t = TileBounces.bounce(fp, route.slots, route.source(term, got, 12), first, ghiMonth);
            double[] rm = reflMonth.clone(), ta = totalAnnual.clone();
            double added = TileBounces.accumulate(fp, t, analysedTotal, rm, ta);
            return new TileState(tile, ids, route, t, rm, ta, added);
        }

        /** The other tiles' values this tile received (one per id, e.g. the annual totals). */
        Lookup received(Optional<Iterable<TileExchange.Packet>> got) {
            return new Lookup(route.foreign, route.source(new double[0], got, 1));
        }
    }

    /** Values a tile received: {@code values[i]} belongs to global id {@code ids[i]}. */
    record Lookup(int[] ids, double[] values) {}

    /** How often the test hook threw in this JVM (local mode: the tests read it). */
    static final java.util.concurrent.atomic.AtomicInteger HOOK_FIRED = new java.util.concurrent.atomic.AtomicInteger();

    static void failOnce(Settings s, String stage, int tile) {
        TaskContext tc = TaskContext.get();
        if (s.failOnceTile() == tile && s.failOnceStage().equals(stage) && tc != null && tc.attemptNumber() == 0) {
            HOOK_FIRED.incrementAndGet();
            throw new IllegalStateException("test hook: tile " + tile + " fails its first attempt at " + stage);
        }
    }

    /** Runs the stages and writes the Parquet rows into {@code parquet} (a folder that must not exist yet). */
    static Outcome run(SparkSession spark, CityModel city, CityPlan plan, Settings s, Path parquet) {
        JavaSparkContext sc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        int nTiles = plan.tiles().size();
        int analysed = plan.analysedCount();
        TilePartitioner tp = new TilePartitioner(plan, partitionCount(sc.sc(), plan));
        Broadcast<CityPlan> bPlan = sc.broadcast(plan);
        Broadcast<byte[]> bTables = sc.broadcast(city.tables().encode());
        double[] ghiMonth = TileBounces.ghiMonthWh(city.sun());
        Map<String, Double> stageS = new LinkedHashMap<>(), stageCpuS = new LinkedHashMap<>();
        List<JavaPairRDD<?, ?>> cached = new ArrayList<>();

        // 1. first pass per tile
        long t0 = System.nanoTime(), c0 = cpuNanos();
        StageProgress.label(sc, "first pass");
        List<Integer> tiles = IntStream.range(0, nTiles).boxed().toList();
        JavaPairRDD<Integer, FirstPasses> firsts = TileShuffle.byKey(sc.parallelize(tiles, tp.numPartitions()).mapToPair(t -> new Tuple2<>(t, t)), tp)
                .mapValues(t -> {
                    failOnce(s, "first-pass", t);
                    return city(s.studyFile(), bTables).firstPass(bPlan.value().tile(t), taskCores());
                }).persist(StorageLevel.MEMORY_AND_DISK());
        cached.add(firsts);
        long[] bytes = new long[nTiles];
        for (Tuple2<Integer, Long> b : firsts.mapValues(FirstPasses::bytes).collect()) bytes[b._1()] = b._2();
        stageS.put("first_pass", (System.nanoTime() - t0) / 1e9);
        stageCpuS.put("first_pass", cpuSince(c0));

        // 2. exchange and bounces
        long t1 = System.nanoTime(), c1 = cpuNanos();
        StageProgress.label(sc, "exchange");
        // once, per tile from its own first pass and the plan: which receivers it needs from which tile
        // (TileExchange.Route); the requests go to the owners, which keep them as what they send
        Broadcast<int[]> bOwner = sc.broadcast(TileExchange.owners(plan));
        JavaPairRDD<Integer, TileState> state = firsts.mapPartitionsToPair(it -> {
            List<Tuple2<Integer, TileState>> l = new ArrayList<>();
            it.forEachRemaining(e -> l.add(new Tuple2<>(e._1(), TileState.initial(e._1(), e._2(), bOwner.value()))));
            return l.iterator();
        }, true).persist(StorageLevel.MEMORY_AND_DISK());
        JavaPairRDD<Integer, TileExchange.Sends> sends = TileShuffle.<TileExchange.Request>grouped(state.flatMapToPair(e -> e._2().route.requests().iterator()), tp)
                .mapValues(TileExchange.Sends::of).persist(StorageLevel.MEMORY_AND_DISK());
        cached.add(sends);
        double tolerance = city.prepared().options().bounceTolerance();
        int maxBounces = city.prepared().options().maxBounces();
        double[] bounceWh = new double[Math.max(1, maxBounces)];
        double reflected = 0;
        int used = 0;
        boolean converged = false;
        for (int b = 0; b < maxBounces; b++) {
            StageProgress.label(sc, "bounce " + (b + 1));
            boolean first = b == 0;
            JavaPairRDD<Integer, Iterable<TileExchange.Packet>> got = exchange(state, sends, tp, false);
            JavaPairRDD<Integer, TileState> next = firsts.join(state).leftOuterJoin(got).mapValues(x -> {
                TileState st = x._1()._2();
                if (first) {
                    failOnce(s, "bounce", st.tile);
                    holdIfAsked(s);
                }
                return st.next(x._1()._1(), x._2(), first, ghiMonth, analysed);
            }).persist(StorageLevel.MEMORY_AND_DISK());
            double[] perTile = new double[nTiles];
            for (Tuple2<Integer, Double> a : next.mapValues(st -> st.added).collect()) perTile[a._1()] = a._2();
            double add = 0;
            for (double a : perTile) add += a;
            state.unpersist(false);
            state = next;
            reflected += add;
            bounceWh[b] = add;
            used = b + 1;
            if (add <= tolerance * reflected) {
                converged = true;
                break;
            }
        }
        cached.add(state);
        StageProgress.label(sc, "exchange of annual totals");
        JavaPairRDD<Integer, Iterable<TileExchange.Packet>> totals = exchange(state, sends, tp, true);
        double[] bounces = Arrays.copyOf(bounceWh, used);
        boolean conv = converged;
        stageS.put("reflection", (System.nanoTime() - t1) / 1e9);
        stageCpuS.put("reflection", cpuSince(c1));

        // 3. finish per tile
        long t2 = System.nanoTime(), c2 = cpuNanos();
        StageProgress.label(sc, "finish");
        JavaPairRDD<Integer, TileOut> out = firsts.join(state).leftOuterJoin(totals).mapValues(x -> {
            FirstPasses fp = x._1()._1();
            TileState st = x._1()._2();
            int tile = st.tile;
            failOnce(s, "finish", tile);
            // the tile's own sums and the totals it received: arrays the size of the tile, not the city
            Lookup got = st.received(x._2()); // ordered by owner tile, then id: sorted by id for the merge
            int[] order = IntStream.range(0, got.ids().length).boxed()
                    .sorted((a, b) -> Integer.compare(got.ids()[a], got.ids()[b])).mapToInt(Integer::intValue).toArray();
            int[] gotIds = new int[order.length];
            double[] gotTotal = new double[order.length];
            for (int i = 0; i < order.length; i++) {
                gotIds[i] = got.ids()[order[i]];
                gotTotal[i] = got.values()[order[i]];
            }
            StagedPasses.TileReflected r = StagedPasses.TileReflected.of(analysed, st.ids, st.reflMonth, st.totalAnnual,
                    gotIds, gotTotal, bounces, conv, tolerance, maxBounces);
            Tile t = bPlan.value().tile(tile);
            CityModel.TileRows rows = city(s.studyFile(), bTables).finish(t, fp, r, taskCores());
            return new TileOut(tile, rows.table(), rows.patchIndex(), rows.metrics());
        }).persist(StorageLevel.MEMORY_AND_DISK());
        cached.add(out);
        List<Tuple2<Integer, TileOut.Head>> heads = out.mapValues(TileOut::head).collect();
        stageS.put("finish", (System.nanoTime() - t2) / 1e9);
        stageCpuS.put("finish", cpuSince(c2));

        // columns in tile order (first seen), PV zones numbered city-wide
        List<String> names = new ArrayList<>();
        List<TileOut.Head> byTile = new ArrayList<>();
        for (Tuple2<Integer, TileOut.Head> h : heads) byTile.add(h._2());
        byTile.sort((a, b) -> Integer.compare(a.tile(), b.tile()));
        for (TileOut.Head h : byTile) for (String c : h.columns()) if (!names.contains(c)) names.add(c);
        Map<Long, Integer> zoneNumber = zoneNumbers(byTile);
        List<Column> columns = names.stream().map(ColumnCatalogue::of).toList();
        Broadcast<Map<Long, Integer>> bZones = sc.broadcast(zoneNumber);
        List<PvZones.Zone> zones = cityZones(byTile, zoneNumber);
        TileOut.ZoneRows zoneRows = TileOut.zoneRows(byTile, zoneNumber);

        long t3 = System.nanoTime(), c3 = cpuNanos();
        StageProgress.label(sc, "write");
        TileParquet.write(sc, out, PatchRows.fileSchema(columns), names, bZones, s, parquet);
        long count = 0;
        for (TileOut.Head h : byTile) count += h.size();
        stageS.put("write", (System.nanoTime() - t3) / 1e9);
        stageCpuS.put("write", cpuSince(c3));
        // per building (a block lies in one tile): area-weighted means of every column but categories
        StageProgress.label(sc, "buildings");
        List<Column> summarised = columns.stream().filter(c -> c.kind() != org.solmass.table.ColumnKind.CATEGORICAL).toList();
        List<org.solmass.output.BuildingsWriter.Building> buildings = BuildingSummaries.of(out, summarised.stream().map(Column::name).toList());
        for (JavaPairRDD<?, ?> c : cached) c.unpersist(false);
        bPlan.destroy();
        bTables.destroy();
        bOwner.destroy();
        bZones.destroy();
        return new Outcome(columns, bounces, conv, count, bytes, stageS, zones, zoneRows, summarised, buildings, stageCpuS,
                tp.numPartitions());
    }

    /** This JVM's CPU time so far, all threads, ns ({@code com.sun.management.OperatingSystemMXBean}); -1 where the JVM does not tell. */
    static long cpuNanos() {
        return java.lang.management.ManagementFactory.getOperatingSystemMXBean() instanceof com.sun.management.OperatingSystemMXBean os
                ? os.getProcessCpuTime() : -1;
    }

    /** CPU seconds since {@code from} ({@link #cpuNanos}), NaN where not told. */
    private static double cpuSince(long from) {
        long now = cpuNanos();
        return from < 0 || now < 0 ? Double.NaN : (now - from) / 1e9;
    }

    /**
     * Each tile sends its receivers' values (the last term's 12 months, or with {@code totals} the
     * annual total) to the tiles that need them: one {@link TileExchange.Packet} per (sending tile,
     * receiving tile) pair, in one shuffle grouped by the receiving tile. A tile's own values stay.
     */
    private static JavaPairRDD<Integer, Iterable<TileExchange.Packet>> exchange(JavaPairRDD<Integer, TileState> state,
            JavaPairRDD<Integer, TileExchange.Sends> sends, TilePartitioner tp, boolean totals) {
        return TileShuffle.<TileExchange.Packet>grouped(state.join(sends).flatMapToPair(e -> {
            TileState st = e._2()._1();
            return totals ? e._2()._2().packets(st.tile, st.ids, st.totalAnnual, 1).iterator()
                    : e._2()._2().packets(st.tile, st.ids, st.term, 12).iterator();
        }), tp);
    }

    /**
     * City-wide PV zone numbers, as the whole model numbers them ({@code metrics.PvZones}: by surface
     * id, then first patch, from 1; the same rule as {@code tiles.LocalCityRunner.merge}).
     */
    static Map<Long, Integer> zoneNumbers(List<TileOut.Head> tiles) {
        List<long[]> keys = new ArrayList<>(); // surface, first patch, tile, local zone
        for (TileOut.Head t : tiles) {
            for (int z = 0; z < t.zoneSurface().length; z++) {
                if (t.zoneSurface()[z] >= 0) keys.add(new long[] {t.zoneSurface()[z], t.zoneFirstPatch()[z], t.tile(), z + 1});
            }
        }
        keys.sort((a, b) -> a[0] != b[0] ? Long.compare(a[0], b[0]) : Long.compare(a[1], b[1]));
        Map<Long, Integer> n = new LinkedHashMap<>();
        for (int i = 0; i < keys.size(); i++) n.put(zoneKey((int) keys.get(i)[2], (int) keys.get(i)[3]), i + 1);
        return n;
    }

    /** The tiles' PV zones with their city-wide numbers ({@link #zoneNumbers}), in number order; null when no tile found PV zones. */
    static List<PvZones.Zone> cityZones(List<TileOut.Head> tiles, Map<Long, Integer> zoneNumber) {
        List<PvZones.Zone> zones = null;
        for (TileOut.Head t : tiles) {
            if (t.zones() == null) continue;
            if (zones == null) zones = new ArrayList<>();
            for (TileOut.ZoneOut z : t.zones()) zones.add(z.zone(zoneNumber.get(zoneKey(t.tile(), z.localId()))));
        }
        if (zones != null) zones.sort((a, b) -> Integer.compare(a.id(), b.id()));
        return zones;
    }
}
