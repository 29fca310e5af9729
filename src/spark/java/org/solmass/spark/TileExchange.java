package org.solmass.spark;

import org.apache.spark.api.java.Optional;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.TileBounces;
import org.solmass.tiles.CityPlan;
import org.solmass.tiles.Tile;
import scala.Tuple2;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The exchange of stage 2 of a city run (docs/city.md, "Stages") as flat arrays: one record per
 * (sending tile, receiving tile) pair and exchange, never one per receiver.
 * <ul>
 * <li>{@link Route}, once per tile, from its own first pass and the plan alone (no shuffle): which of
 * the ids its reflector lists name it owns, which it must receive and from which tile, and where each
 * reflector-list entry reads in the flat source of a bounce (its own entries first, then what each
 * sending tile sends, in tile order);</li>
 * <li>{@link Request}: what a tile needs from one other tile (its ids, ascending), shuffled once to
 * the owner and gathered into that tile's {@link Sends};</li>
 * <li>{@link Packet}: at each exchange, the values of a request's ids in the request's order.</li>
 * </ul>
 * A tile's own values never leave it. All are plain classes of arrays, registered with Kryo
 * ({@link CityKryo}).
 */
final class TileExchange {
    private TileExchange() {}

    /** The tile index owning each receiver of the plan, by global id. */
    static int[] owners(CityPlan plan) {
        int[] owner = new int[plan.receiverCount()];
        Arrays.fill(owner, -1);
        for (Tile t : plan.tiles()) for (int id : t.receivers()) owner[id] = t.index();
        return owner;
    }

    /** Tile {@code to} needs the values of {@code ids} (ascending) from the tile that owns them. */
    static final class Request implements Serializable {
        private static final long serialVersionUID = 1L;
        final int to;
        final int[] ids;

        Request(int to, int[] ids) {
            this.to = to;
            this.ids = ids;
        }
    }

    /** The values sent by tile {@code from} at one exchange: {@code width} per id of the request, in its order. */
    static final class Packet implements Serializable {
        private static final long serialVersionUID = 1L;
        final int from;
        final double[] values;

        Packet(int from, double[] values) {
            this.from = from;
            this.values = values;
        }
    }

    /** Where a tile's values come from at each exchange (computed once per tile). */
    static final class Route implements Serializable {
        private static final long serialVersionUID = 1L;
        final int tile;
        /** The tile's own entries (its first pass's ids). */
        final int own;
        /** The tiles it receives from, ascending, and how many ids from each. */
        final int[] from, count;
        /** The ids it receives, by sending tile, then ascending: the slots after its own entries. */
        final int[] foreign;
        /** Per reflector-list entry (entries in order, each list in order): its slot ({@link TileBounces#slots}). */
        final int[] slots;

        private Route(int tile, int own, int[] from, int[] count, int[] foreign, int[] slots) {
            this.tile = tile;
            this.own = own;
            this.from = from;
            this.count = count;
            this.foreign = foreign;
            this.slots = slots;
        }

        /**
         * @param owner {@link #owners}
         */
        static Route of(int tile, FirstPasses fp, int[] owner) {
            int[] ids = fp.ids(), need = TileBounces.needed(fp);
            long[] key = new long[need.length]; // owner tile, id
            int k = 0;
            for (int j : need) {
                if (Arrays.binarySearch(ids, j) >= 0) continue;
                if (owner[j] < 0 || owner[j] == tile) throw new IllegalStateException("receiver " + j + " named by tile " + tile + " has no other owner");
                key[k++] = ((long) owner[j] << 32) | j;
            }
            key = Arrays.copyOf(key, k);
            Arrays.sort(key);
            int[] foreign = new int[k];
            List<int[]> runs = new ArrayList<>(); // tile, count
            for (int i = 0; i < k; i++) {
                foreign[i] = (int) key[i];
                int o = (int) (key[i] >>> 32);
                if (runs.isEmpty() || runs.get(runs.size() - 1)[0] != o) runs.add(new int[] {o, 0});
                runs.get(runs.size() - 1)[1]++;
            }
            int[] from = new int[runs.size()], count = new int[runs.size()];
            for (int i = 0; i < from.length; i++) {
                from[i] = runs.get(i)[0];
                count[i] = runs.get(i)[1];
            }
            long[] byId = new long[k]; // id, slot
            for (int i = 0; i < k; i++) byId[i] = ((long) foreign[i] << 32) | (ids.length + i);
            Arrays.sort(byId);
            int[] sortedIds = new int[k];
            for (int i = 0; i < k; i++) sortedIds[i] = (int) (byId[i] >>> 32);
            int[] slots = TileBounces.slots(fp, j -> {
                int p = Arrays.binarySearch(ids, j);
                return p >= 0 ? p : (int) byId[Arrays.binarySearch(sortedIds, j)];
            });
            return new Route(tile, ids.length, from, count, foreign, slots);
        }

        /** One request per tile it receives from, keyed by that tile. */
        List<Tuple2<Integer, Request>> requests() {
            List<Tuple2<Integer, Request>> l = new ArrayList<>(from.length);
            int at = 0;
            for (int i = 0; i < from.length; i++) {
                l.add(new Tuple2<>(from[i], new Request(tile, Arrays.copyOfRange(foreign, at, at + count[i]))));
                at += count[i];
            }
            return l;
        }

        /**
         * The flat source of one exchange: {@code head} (the tile's own values, or nothing), then
         * each sending tile's packet in {@link #from} order ({@code width} values per id).
         */
        double[] source(double[] head, Optional<Iterable<Packet>> got, int width) {
            List<Packet> l = new ArrayList<>();
            if (got.isPresent()) got.get().forEach(l::add);
            l.sort((a, b) -> Integer.compare(a.from, b.from));
            if (l.size() != from.length) throw new IllegalStateException("tile " + tile + " got " + l.size() + " packets, expected " + from.length);
            double[] src = Arrays.copyOf(head, head.length + width * foreign.length);
            int at = head.length;
            for (int i = 0; i < from.length; i++) {
                Packet p = l.get(i);
                if (p.from != from[i] || p.values.length != width * count[i])
                    throw new IllegalStateException("tile " + tile + " got an unexpected packet from tile " + p.from);
                System.arraycopy(p.values, 0, src, at, p.values.length);
                at += p.values.length;
            }
            return src;
        }
    }

    /** What a tile sends at each exchange: per receiving tile (ascending), the ids it asked for. */
    static final class Sends implements Serializable {
        private static final long serialVersionUID = 1L;
        final int[] to;
        final int[][] ids;

        private Sends(int[] to, int[][] ids) {
            this.to = to;
            this.ids = ids;
        }

        static Sends of(Iterable<Request> requests) {
            List<Request> l = new ArrayList<>();
            requests.forEach(l::add);
            l.sort((a, b) -> Integer.compare(a.to, b.to));
            int[] to = new int[l.size()];
            int[][] ids = new int[l.size()][];
            for (int i = 0; i < to.length; i++) {
                to[i] = l.get(i).to;
                ids[i] = l.get(i).ids;
            }
            return new Sends(to, ids);
        }

        /**
         * The packets of one exchange, keyed by receiving tile.
         *
         * @param ownIds the sending tile's ids, ascending
         * @param values {@code width} values per entry of {@code ownIds}
         */
        List<Tuple2<Integer, Packet>> packets(int tile, int[] ownIds, double[] values, int width) {
            List<Tuple2<Integer, Packet>> l = new ArrayList<>(to.length);
            for (int i = 0; i < to.length; i++) {
                int[] want = ids[i];
                double[] v = new double[width * want.length];
                for (int q = 0; q < want.length; q++) {
                    int p = Arrays.binarySearch(ownIds, want[q]);
                    if (p < 0) throw new IllegalStateException("tile " + tile + " does not hold receiver " + want[q]);
                    System.arraycopy(values, width * p, v, width * q, width);
                }
                l.add(new Tuple2<>(to[i], new Packet(tile, v)));
            }
            return l;
        }
    }
}
